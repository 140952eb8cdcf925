/** Field checks' table for the data source, and what the equipment record reads. */
import { FieldCheck } from './field-check.entity';

export const checkEntities = [FieldCheck];
export { checksForRecord, failedCheckAssetIds, type CheckEntry } from './record-entries';
