/** Incidents' tables for the data source, and what the equipment record reads; other components open incidents
 * through incidents.service.ts. */
import { Incident, IncidentPhoto } from './incident.entity';

export const incidentEntities = [Incident, IncidentPhoto];
export { incidentsForRecord, photoThumbnails, type IncidentEntry } from './record-entries';
