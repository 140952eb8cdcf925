/** Holds' table for the data source, and what the equipment record reads; other components place, find and release
 * holds through holds.service.ts. */
import { Hold } from './hold.entity';

export const holdEntities = [Hold];
export { heldAssetIds, holdsForRecord, type HoldEntry } from './record-entries';
