/** Routines' surface: the shape of the work other components hand the scheduler, and the run log's tables. */
import { RoutineLease, RoutineRun } from './routine-run.entity';

export const routineEntities = [RoutineRun, RoutineLease];
export type { Routine, RoutineContext } from './routine';
