/** Due dates and calibration states, computed the same way as the server (shared/calibration/due-date.ts). */
export { calibrationState, calibrationStates, dueOnForPlan, todayIn, DEFAULT_DUE_SOON_DAYS } from '../../shared/calibration/due-date';
export type { CalibrationState } from '../../shared/calibration/due-date';
