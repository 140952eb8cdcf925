/** Due dates and calibration states, computed the same way as the server (shared/calibration/due-date.ts). */
export { addDays, calibrationState, calibrationStates, dueDate, dueOnForPlan, todayIn, DEFAULT_DUE_SOON_DAYS } from '../../shared/calibration/due-date';
export type { CalibrationState } from '../../shared/calibration/due-date';
/** The interval review of OIML D 10 / ILAC-G24 (shared/calibration/interval-review.ts). */
export { suggestInterval, defaultIntervalPolicy } from '../../shared/calibration/interval-review';
export type { AsFound, IntervalChange, IntervalSuggestion } from '../../shared/calibration/interval-review';
