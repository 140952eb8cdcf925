import * as Yup from 'yup';
import { MAX_PASSWORD_BYTES, passwordBytes, passwordWeakness } from '../../shared/auth/password-strength';
import { MIN_PASSWORD_LENGTH } from '../../shared/schemas/users';

export { MIN_PASSWORD_LENGTH };

/**
 * A new password as the server judges it: long enough, within bcrypt's 72
 * bytes, and not easy to guess for this person and firm. A preview only (the
 * server decides); `context` names what a guesser would try, from the form's
 * other values.
 */
export const newPasswordSchema = (required: string, context: (values: Record<string, unknown>) => (string | undefined)[]) =>
  Yup.string()
    .required(required)
    .min(MIN_PASSWORD_LENGTH, `Use at least ${MIN_PASSWORD_LENGTH} characters.`)
    .test(
      'bcrypt-bytes',
      `Use at most ${MAX_PASSWORD_BYTES} bytes: letters with accents count two, most symbols three.`,
      (value) => !value || passwordBytes(value) <= MAX_PASSWORD_BYTES,
    )
    .test('guessable', async function (value) {
      if (!value || value.length < MIN_PASSWORD_LENGTH) return true;
      const weakness = await passwordWeakness(
        value,
        context(this.parent as Record<string, unknown>).filter((c): c is string => !!c),
      );
      return weakness ? this.createError({ message: `This password ${weakness}` }) : true;
    });
