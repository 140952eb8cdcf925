/** Auth's table for the data source: sign-in attempts counted across instances. */
import { LoginAttempt } from './login-attempt.entity';

export const authEntities = [LoginAttempt];
