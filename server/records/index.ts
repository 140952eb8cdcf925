/** The equipment record and the audit pack: composed from what fleet, calibration, checks, holds, incidents, users
 * and audit answer through their index files, so none of them needs to know the others. Owns no table. */
export { RecordsService } from './records.service';
export { recordsRoutes } from './records.routes';
