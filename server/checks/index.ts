/** Field checks' table for the data source. */
import { FieldCheck } from './field-check.entity';

export const checkEntities = [FieldCheck];
