/** Audit's table for the data source; other components append lines only through audit.service.ts. */
import { AuditEvent } from './audit-event.entity';

export const auditEntities = [AuditEvent];
