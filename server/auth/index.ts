/** Auth's tables for the data source: sign-in attempts counted across instances, sessions, mailed account links. */
import { AccountLink } from './account-link.entity';
import { LoginAttempt } from './login-attempt.entity';
import { UserSession } from './user-session.entity';

export const authEntities = [LoginAttempt, UserSession, AccountLink];
