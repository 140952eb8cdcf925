import { AuditEvent } from './audit/audit-event.entity';
import { LoginAttempt } from './auth/login-attempt.entity';
import { DepositAuthorization } from './billing/deposit-authorization.entity';
import { Invoice, InvoicePayment } from './billing/invoice.entity';
import { PaymentEvent } from './billing/payment-event.entity';
import { Booking, BookingItem } from './bookings/booking.entity';
import { Job } from './bookings/job.entity';
import { CalibrationEvent, CertificateFile } from './calibration/calibration-event.entity';
import { ImpactReview, ImpactReviewItem } from './calibration/impact-review.entity';
import { LabTrip, LabTripItem } from './calibration/lab-trip.entity';
import { FieldCheck } from './checks/field-check.entity';
import { createDataSource } from './db/data-source';
import { DocumentCounter } from './db/document-counter.entity';
import { fleetEntities } from './fleet';
import { Hold } from './holds/hold.entity';
import { Incident, IncidentPhoto } from './incidents/incident.entity';
import { JobLease, JobRun } from './jobs/job-run.entity';
import { OutboxAttachment } from './notifications/outbox-attachment.entity';
import { OutboxMessage } from './notifications/outbox-message.entity';
import { SinkMessage } from './notifications/sink-message.entity';
import { Organization } from './organizations/organization.entity';
import { Customer } from './rentals/customer.entity';
import { RateCard } from './rentals/rate-card.entity';
import { Rental } from './rentals/rental.entity';
import { User } from './users/user.entity';

/** Every entity the data source knows, composed here at the top; a new component adds its own. */
export const entities = [
  Organization, User, LoginAttempt, AuditEvent, OutboxMessage, SinkMessage, JobRun, JobLease, ...fleetEntities, FieldCheck, Hold, Incident, IncidentPhoto,
  Job, Booking, BookingItem, CertificateFile, CalibrationEvent, LabTrip, LabTripItem, ImpactReview, ImpactReviewItem, Customer, RateCard, Rental,
  DepositAuthorization, Invoice, InvoicePayment, DocumentCounter, PaymentEvent, OutboxAttachment,
];

/** Nestkeeper's database: the entities above over db/'s connection settings. */
export const openDataSource = (url: string, poolSize?: number) => createDataSource(url, entities, poolSize);

/** For the TypeORM CLI (`npm run migration:generate`). */
export default openDataSource(process.env.DATABASE_URL ?? 'postgres://localhost/nestkeeper');
