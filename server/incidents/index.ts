/** Incidents' tables for the data source; other components open incidents through incidents.service.ts. */
import { Incident, IncidentPhoto } from './incident.entity';

export const incidentEntities = [Incident, IncidentPhoto];
