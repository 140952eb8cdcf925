/** Users' surface: the firm's people as plain records; the sign-in secrets only for auth and the calendar feed. */
import { User } from './user.entity';

export const userEntities = [User];
export { activeStaff, findPerson, peopleNames, publicUser, type PublicUser } from './people';
export {
  accountByEmail,
  addPerson,
  calendarOwner,
  emailInUse,
  endSessions,
  ownAccount,
  replacePasswordHash,
  saveSecondStep,
  secondStepOf,
  setCalendarToken,
  type Account,
  type SecondStepRecord,
} from './accounts';
