import type { ZxcvbnFactory } from '@zxcvbn-ts/core';

/**
 * Whether a new password is too easy to guess, judged by zxcvbn-ts with its
 * common and English dictionaries plus the words a guesser tries first for
 * this person: their e-mail and name, the firm's name, the product's name.
 * The server decides; the browser previews with the same check. The
 * dictionaries are large, so they load on first use (their own chunk in the
 * browser, once per process on the server).
 */

/** zxcvbn's scale is 0–4; 3 is its "safely unguessable" band (about 10^8 guesses and up). */
export const MIN_PASSWORD_SCORE = 3;

/** bcrypt reads the first 72 bytes of a password and ignores the rest, so longer ones are refused (DEVELOPERS.md). */
export const MAX_PASSWORD_BYTES = 72;

/** UTF-8 bytes, as bcrypt counts them: "ü" is two, "€" three. */
export const passwordBytes = (password: string) => new TextEncoder().encode(password).length;

let estimator: Promise<ZxcvbnFactory> | undefined;

const loadEstimator = () =>
  (estimator ??= Promise.all([import('@zxcvbn-ts/core'), import('@zxcvbn-ts/language-common'), import('@zxcvbn-ts/language-en')]).then(
    ([core, common, en]) =>
      new core.ZxcvbnFactory({
        dictionary: { ...common.dictionary, ...en.dictionary },
        graphs: common.adjacencyGraphs,
        translations: {
          ...en.translations,
          warnings: { ...en.translations.warnings, userInputs: 'It is made from a name or address that anyone who knows you or the firm would try.' },
        },
      }),
  ));

/** The context as a guesser would try it: each whole value and its parts ("ines.varga@wexley.test" → ines, varga, wexley). */
const guesses = (context: string[]) =>
  ['nestkeeper', ...context.flatMap((value) => [value, ...value.split(/[^\p{L}\p{N}]+/u)])].filter((word) => word.length >= 3);

/** Plain words saying why the password is too easy to guess, or null when it is strong enough. */
export async function passwordWeakness(password: string, context: string[] = []): Promise<string | null> {
  const result = (await loadEstimator()).check(password, guesses(context));
  if (result.score >= MIN_PASSWORD_SCORE) return null;
  const { warning, suggestions } = result.feedback;
  return ['is too easy to guess.', warning, ...suggestions].filter(Boolean).join(' ');
}
