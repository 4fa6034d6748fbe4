/** Typed errors that the error middleware turns into `{ error: { code, message, fields? } }`. */
export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly fields?: Record<string, string>,
    /** For a 409: the server's current state, sent beside the error (`ConflictBody` in features/api/contract.ts). */
    readonly current?: unknown,
  ) {
    super(message);
    this.name = 'AppError';
  }
}

export const badRequest = (message: string, fields?: Record<string, string>) => new AppError(400, 'invalid_input', message, fields);
export const unauthorized = (message = 'Please sign in.') => new AppError(401, 'unauthenticated', message);
export const forbidden = (message = 'You do not have access to this.') => new AppError(403, 'forbidden', message);
export const notFound = (what = 'This record') => new AppError(404, 'not_found', `${what} was not found.`);
export const conflict = (message: string) => new AppError(409, 'conflict', message);
/** 409 with the current state, so the client can show what changed or merge and retry. */
export const staleVersion = (code: string, message: string, current: unknown) => new AppError(409, code, message, undefined, current);
export const tooManyRequests = (message: string) => new AppError(429, 'rate_limited', message);
