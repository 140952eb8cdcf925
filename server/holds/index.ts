/** Holds' table for the data source; other components place, find and release holds through holds.service.ts. */
import { Hold } from './hold.entity';

export const holdEntities = [Hold];
