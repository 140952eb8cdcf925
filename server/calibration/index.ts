/** Calibration's tables for the data source, and what the equipment record reads; other components use its *.service.ts files. */
import { CalibrationEvent, CertificateFile } from './calibration-event.entity';
import { ImpactReview, ImpactReviewItem } from './impact-review.entity';
import { LabTrip, LabTripItem } from './lab-trip.entity';

export const calibrationEntities = [CertificateFile, CalibrationEvent, LabTrip, LabTripItem, ImpactReview, ImpactReviewItem];
export {
  calibrationsForRecord,
  certificateBytes,
  impactReviewsForRecord,
  outOfToleranceAssetIds,
  type CalibrationEntry,
  type ImpactReviewEntry,
} from './record-entries';
