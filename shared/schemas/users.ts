import { z } from 'zod';
import { MAX_PASSWORD_BYTES, passwordBytes } from '../auth/password-strength';
import { roles } from '../auth/roles';
import { emailAddress } from './common';

export const MIN_PASSWORD_LENGTH = 10;

const email = emailAddress;
// How guessable a password is depends on the person and the firm, so the services check that (shared/auth/password-strength.ts).
const password = z
  .string()
  .min(MIN_PASSWORD_LENGTH, `must be at least ${MIN_PASSWORD_LENGTH} characters`)
  .refine(
    (p) => passwordBytes(p) <= MAX_PASSWORD_BYTES,
    `must be at most ${MAX_PASSWORD_BYTES} bytes: bcrypt ignores the rest (accented letters count 2, most symbols 3)`,
  );

export const loginPayload = z.object({ email, password: z.string().min(1, 'is required').max(200) });

export const changeOwnPasswordPayload = z.object({ currentPassword: z.string().min(1, 'is required'), newPassword: password });

export const createUserPayload = z.object({
  email,
  name: z.string().trim().min(1, 'is required').max(120),
  role: z.enum(roles, { message: `must be one of ${roles.join(', ')}` }),
  password,
});

export const updateUserPayload = z
  .object({
    name: z.string().trim().min(1, 'is required').max(120).optional(),
    role: z.enum(roles, { message: `must be one of ${roles.join(', ')}` }).optional(),
    disabled: z.boolean().optional(),
  })
  .strict();

export const resetPasswordPayload = z.object({ password });

/** The secret part of a mailed link (base64url of 32 random bytes). */
const linkToken = z
  .string()
  .trim()
  .regex(/^[A-Za-z0-9_-]{20,100}$/, 'is not a link Nestkeeper sent');

export const inviteUserPayload = z.object({ email, role: z.enum(roles, { message: `must be one of ${roles.join(', ')}` }) });
export const linkTokenPayload = z.object({ token: linkToken });
export const acceptInvitationPayload = z.object({ token: linkToken, name: z.string().trim().min(1, 'is required').max(120), password });
export const requestPasswordResetPayload = z.object({ email });
export const completePasswordResetPayload = z.object({ token: linkToken, password });

/** Six digits from the authenticator app, or a recovery code (spaces and dashes ignored). */
export const secondStepCode = z
  .string()
  .transform((c) => c.replace(/[\s-]/g, '').toUpperCase())
  .pipe(z.string().regex(/^(\d{6}|[A-Z2-7]{10})$/, 'must be the 6 digits your app shows, or one of your recovery codes'));
export const secondStepSignInPayload = z.object({ ticket: z.string().min(1, 'is required').max(2000), code: secondStepCode });
export const confirmSecondStepPayload = z.object({ code: z.string().regex(/^\d{6}$/, 'must be the 6 digits your app shows') });
export const turnOffSecondStepPayload = z.object({ password: z.string().min(1, 'is required').max(200) });
