/**
 * Error factories. Every error a client sees has an HTTP status and a stable machine code,
 * and names the field at fault when there is one: `{ error: { code, message, field? } }`.
 */
export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly field?: string,
  ) {
    super(message);
    this.name = 'AppError';
  }

  toJSON() {
    return { error: { code: this.code, message: this.message, ...(this.field ? { field: this.field } : {}) } };
  }
}

export const badRequest = (message: string, field?: string, code = 'invalid_request') =>
  new AppError(400, code, message, field);
export const unauthorized = (message = 'Sign in first.', code = 'unauthorized') => new AppError(401, code, message);
export const forbidden = (message = 'Your role may not do this.', code = 'forbidden') =>
  new AppError(403, code, message);
export const notFound = (what: string) => new AppError(404, 'not_found', `${what} was not found.`);
export const conflict = (message: string, field?: string, code = 'conflict') => new AppError(409, code, message, field);
export const tooManyRequests = (message: string) => new AppError(429, 'rate_limited', message);
