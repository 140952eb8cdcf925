import type { ZodError } from 'zod';

/** An error the API reports to its caller: a status, a stable code and words
 * a person can act on (API.md "Errors"). Services throw these; the one error
 * handler turns them into `{error: {code, message, details?}}`. */
export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly details?: Record<string, unknown>,
  ) {
    super(message);
  }
}

export const notFound = (what: string) => new AppError(404, 'not_found', `${what} was not found.`);
export const forbidden = (message = 'Your role may not do this.') => new AppError(403, 'forbidden', message);
export const conflict = (message: string, details?: Record<string, unknown>) => new AppError(409, 'conflict', message, details);
export const ruleBroken = (code: string, message: string, details?: Record<string, unknown>) => new AppError(422, code, message, details);

export function invalidInput(error: ZodError): AppError {
  const fields: Record<string, string> = {};
  for (const issue of error.issues) {
    const path = issue.path.join('.') || '(body)';
    fields[path] ??= issue.message;
  }
  return new AppError(400, 'invalid_input', 'Some fields are missing or wrong.', { fields });
}
