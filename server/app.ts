import path from 'node:path';
import cookieParser from 'cookie-parser';
import express, { type Express } from 'express';
import helmet from 'helmet';
import type { Transporter } from 'nodemailer';
import type { DataSource } from 'typeorm';
import { AccountLinksService } from './auth/account-links.service';
import { accountRoutes } from './auth/account.routes';
import { AuthService } from './auth/auth.service';
import { authRoutes } from './auth/auth.routes';
import { Sealing } from './auth/sealing';
import { SecondStep } from './auth/second-step';
import { PgRateLimitStore } from './auth/pg-rate-limit-store';
import { csrfGuard } from './auth/csrf';
import { createPassport } from './auth/passport';
import { signingKey } from './auth/tokens';
import { paymentMode, type Config } from './config';
import { healthRoutes } from './health/health.routes';
import { backupRoutine } from './backups';
import { DatabaseWatch } from './db/reachability';
import { databaseGate } from './http/database-errors';
import { errorHandler, unknownApiRoute } from './http/error-handler';
import { createLogger, requestLogging, type Logger } from './http/logging';
import { Metrics, metricsAccess } from './http/metrics';
import { registerOperatorGauges } from './operator-metrics';
import { OLD_JOBS_PATH, ROUTINES_PATH, routinesRoutes } from './routines/routines.routes';
import { RoutinesService } from './routines/routines.service';
import { notificationsRoutes } from './notifications/notifications.routes';
import { outboxRoutine } from './notifications/deliver-outbox.routine';
import { AssetsService } from './fleet/assets.service';
import { FleetDocumentsService } from './fleet/fleet-documents.service';
import { fleetRoutes } from './fleet/fleet.routes';
import { KitsService } from './fleet/kits.service';
import { kitsRoutes } from './fleet/kits.routes';
import { settingsRoutes } from './organizations/settings.routes';
import { BookingsService } from './bookings/bookings.service';
import { bookingsRoutes } from './bookings/bookings.routes';
import { CalendarService } from './bookings/calendar';
import { DeskService } from './bookings/desk.service';
import { HandoverService } from './bookings/handover.service';
import { JobsRegisterService } from './bookings/jobs.service';
import { lateReturnsRoutine } from './bookings/late-returns.routine';
import { CalibrationService } from './calibration/calibration.service';
import { calibrationRoutes } from './calibration/calibration.routes';
import { dueScanRoutine } from './calibration/due-scan.routine';
import { ImpactService } from './calibration/impact.service';
import { LabService } from './calibration/lab.service';
import { ReviewService } from './calibration/review.service';
import { CustomersService } from './rentals/customers.service';
import { RateCardsService } from './rentals/rate-cards.service';
import { RentalsService } from './rentals/rentals.service';
import { rentalsRoutes } from './rentals/rentals.routes';
import { renterRoutes } from './rentals/renter.routes';
import { RenterService } from './rentals/renter.service';
import { repriceRental } from './rentals/pricing';
import { billingRoutes } from './billing/billing.routes';
import { BillingReportsService } from './billing/billing-reports.service';
import { depositRenewalsRoutine } from './billing/deposit-renewals.routine';
import { DepositRequestsService } from './billing/deposit-requests.service';
import { DepositsService } from './billing/deposits.service';
import { InvoicesService } from './billing/invoices.service';
import { createPaymentClient } from './billing/payment-client';
import { PaymentGateway } from './billing/payment-gateway';
import { paymentWebhookRoutes } from './billing/payment-webhooks';
import { rentalMoney } from './billing/rental-money';
import { ChecksService } from './checks/checks.service';
import { checksRoutes } from './checks/checks.routes';
import { HoldsService } from './holds/holds.service';
import { holdsRoutes } from './holds/holds.routes';
import { IncidentsService } from './incidents/incidents.service';
import { FieldService } from './field/field.service';
import { fieldRoutes } from './field/field.routes';
import { RecordsService, recordsRoutes } from './records';
import { incidentsRoutes } from './incidents/incidents.routes';
import { UsersService } from './users/users.service';
import { usersRoutes } from './users/users.routes';

/** `log` defaults to one made from the config (tests hand in their own to read the lines). */
export type AppDeps = { config: Config; db: DataSource; mail: Transporter; log?: Logger };

/** Builds the Express app and its services; `index.ts` decides when to listen. */
export function buildApp({ config, db, mail, log = createLogger({ level: config.LOG_LEVEL, format: config.LOG_FORMAT }) }: AppDeps): {
  app: Express;
  routines: RoutinesService;
  watch: DatabaseWatch;
  log: Logger;
} {
  const watch = new DatabaseWatch(db, log);
  const metrics = new Metrics();
  registerOperatorGauges(metrics, db, watch);
  const routineRuns = metrics.counter('nestkeeper_routine_runs_total', 'Routine runs on this instance, by routine and outcome', ['routine', 'outcome']);
  const users = new UsersService(db, config.BCRYPT_COST);
  const key = signingKey(config.JWT_SECRET);
  const secondStep = new SecondStep(db, new Sealing(config.JWT_SECRET));
  const auth = new AuthService(db, users, key, secondStep);
  const gateway = new PaymentGateway(createPaymentClient(config));
  const deposits = new DepositsService(db, gateway);
  const nightlyBackup = config.NIGHTLY_BACKUP
    ? [
        backupRoutine({
          databaseUrl: config.DATABASE_URL,
          dir: config.BACKUP_DIR,
          pgBin: config.PG_BIN,
          keep: { daily: config.BACKUP_KEEP_DAILY, weekly: config.BACKUP_KEEP_WEEKLY },
        }),
      ]
    : [];
  const routineList = [outboxRoutine(mail, config.MAIL_FROM), lateReturnsRoutine(), dueScanRoutine(), depositRenewalsRoutine(deposits), ...nightlyBackup];
  const routines = new RoutinesService(db, routineList, {
    watch,
    log: log.child({ component: 'routines' }),
    onRunFinished: (routine, outcome) => routineRuns.inc({ routine, outcome }),
  });
  const publicUrl = config.PUBLIC_URL ?? `http://127.0.0.1:${config.PORT}`;
  const accountLinks = new AccountLinksService(db, users, auth, publicUrl);
  const secureCookies = (config.PUBLIC_URL ?? '').startsWith('https:');
  const assets = new AssetsService(db, publicUrl);
  const kits = new KitsService(db, publicUrl);
  const fleetDocuments = new FleetDocumentsService(db, publicUrl);

  const app = express();
  app.set('trust proxy', config.TRUST_PROXY);
  app.disable('x-powered-by');
  app.locals.passport = createPassport(db, key);
  app.use(requestLogging(log), metrics.observeRequests);
  app.get('/metrics', metricsAccess(config.METRICS_TOKEN), metrics.serve);
  app.use(
    helmet({
      contentSecurityPolicy: {
        directives: {
          'default-src': ["'self'"],
          'img-src': ["'self'", 'data:', 'blob:'],
          'style-src': ["'self'", "'unsafe-inline'"],
          'frame-src': ["'self'"],
          'upgrade-insecure-requests': null,
        },
      },
    }),
  );
  app.use(cookieParser());
  // Before the JSON parser: the signature covers the raw bytes.
  app.use(paymentWebhookRoutes(db, gateway, config.PAYMENT_WEBHOOK_SECRET));
  app.use('/api', express.json({ limit: '1mb' }), csrfGuard);

  app.use('/api', healthRoutes(db, watch));
  app.use('/api', databaseGate(watch));
  app.use(
    '/api/auth',
    authRoutes(auth, accountLinks, {
      secureCookies,
      limits: {
        attemptsPer10Min: config.LOGIN_ATTEMPTS_PER_10_MIN,
        resetsPerHourPerEmail: config.RESET_REQUESTS_PER_HOUR_PER_EMAIL,
        resetsPerHourPerAddress: config.RESET_REQUESTS_PER_HOUR_PER_ADDRESS,
        store: (prefix) => new PgRateLimitStore(db, prefix),
      },
    }),
  );
  app.use('/api', accountRoutes(auth, secondStep, accountLinks, { secureCookies }));
  app.use('/api/users', usersRoutes(users));
  app.use('/api/mailbox', notificationsRoutes(db));
  app.use(ROUTINES_PATH, routinesRoutes(routines));
  app.use(OLD_JOBS_PATH, routinesRoutes(routines, OLD_JOBS_PATH));
  app.use('/api/settings', settingsRoutes(db));
  app.use('/api/assets', fleetRoutes(db, assets, fleetDocuments));
  app.use('/api/kits', kitsRoutes(kits, fleetDocuments));
  const checks = new ChecksService(db);
  app.use('/api', checksRoutes(checks));
  app.use('/api/assets', holdsRoutes(new HoldsService(db)));
  app.use('/api/incidents', incidentsRoutes(new IncidentsService(db)));
  const desk = new DeskService(db);
  app.use('/api/field', fieldRoutes(new FieldService({ desk, assets, checks })));
  const bookings = new BookingsService(db, {
    onReschedule: (tx, booking) => repriceRental(tx, booking, rentalMoney),
    onCancel: (tx, booking) => deposits.releaseForCancelledBooking(tx, booking),
  });
  // Rentals learn a rental's money from billing's answer; billing builds on rentals' surface.
  const rentals = new RentalsService(db, rentalMoney);
  app.use(
    '/api',
    bookingsRoutes({
      bookings,
      handover: new HandoverService(db, rentals.handoverGates),
      desk,
      jobs: new JobsRegisterService(db),
      calendar: new CalendarService(db, publicUrl),
    }),
  );
  app.use(
    '/api',
    calibrationRoutes({ calibration: new CalibrationService(db), impact: new ImpactService(db), lab: new LabService(db), review: new ReviewService(db) }),
  );
  app.use('/api', recordsRoutes(new RecordsService(db, publicUrl)));
  app.use('/api/renter', renterRoutes(new RenterService(db, rentalMoney)));
  app.use('/api', rentalsRoutes({ customers: new CustomersService(db), rateCards: new RateCardsService(db), rentals }));
  app.use(
    '/api',
    billingRoutes({
      deposits,
      requests: new DepositRequestsService(db, gateway, publicUrl),
      invoices: new InvoicesService(db),
      reports: new BillingReportsService(db),
      payments: { mode: paymentMode(config), publishableKey: config.PAYMENT_PUBLISHABLE_KEY },
    }),
  );
  app.use('/api', unknownApiRoute);

  const clientDir = path.resolve(config.CLIENT_DIR);
  app.use(express.static(clientDir, { index: false, maxAge: '1h' }));
  app.get(/^\/(?!api\/).*/, (_req, res, next) => res.sendFile(path.join(clientDir, 'index.html'), (err) => err && next()));
  app.use(errorHandler);
  return { app, routines, watch, log };
}
