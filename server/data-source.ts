import { auditEntities } from './audit';
import { authEntities } from './auth';
import { DepositAuthorization } from './billing/deposit-authorization.entity';
import { DepositRequest } from './billing/deposit-request.entity';
import { Invoice, InvoicePayment } from './billing/invoice.entity';
import { MoneyMail } from './billing/money-mail.entity';
import { PaymentEvent } from './billing/payment-event.entity';
import { bookingEntities } from './bookings';
import { calibrationEntities } from './calibration';
import { checkEntities } from './checks';
import { createDataSource } from './db/data-source';
import { DocumentCounter } from './db/document-counter.entity';
import { fleetEntities } from './fleet';
import { holdEntities } from './holds';
import { incidentEntities } from './incidents';
import { notificationEntities } from './notifications';
import { organizationEntities } from './organizations';
import { Customer } from './rentals/customer.entity';
import { RateCard } from './rentals/rate-card.entity';
import { Rental } from './rentals/rental.entity';
import { AgreementAcceptance, RenterLink } from './rentals/renter-link.entity';
import { routineEntities } from './routines';
import { userEntities } from './users';

/** Every entity the data source knows, composed here at the top; each component's index.ts lists its own. */
export const entities = [
  ...organizationEntities,
  ...userEntities,
  ...authEntities,
  ...auditEntities,
  ...notificationEntities,
  ...routineEntities,
  ...fleetEntities,
  ...checkEntities,
  ...holdEntities,
  ...incidentEntities,
  ...bookingEntities,
  ...calibrationEntities,
  Customer,
  RateCard,
  Rental,
  RenterLink,
  AgreementAcceptance,
  DepositAuthorization,
  DepositRequest,
  Invoice,
  InvoicePayment,
  MoneyMail,
  DocumentCounter,
  PaymentEvent,
];

/** Nestkeeper's database: the entities above over db/'s connection settings. */
export const openDataSource = (url: string, poolSize?: number) => createDataSource(url, entities, poolSize);

/** For the TypeORM CLI (`npm run migration:generate`). */
export default openDataSource(process.env.DATABASE_URL ?? 'postgres://localhost/nestkeeper');
