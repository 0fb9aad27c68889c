/** Typed errors thrown by services; the error middleware turns them into `{ error: { code, message, field? } }`. */
export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly field?: string,
  ) {
    super(message);
  }
}
export class InvalidError extends AppError {
  constructor(message: string, field?: string) {
    super(400, 'invalid', message, field);
  }
}
export class UnauthenticatedError extends AppError {
  constructor(message = 'Sign in first.') {
    super(401, 'unauthenticated', message);
  }
}
export class ForbiddenError extends AppError {
  constructor(message = 'Your role does not allow this.') {
    super(403, 'forbidden', message);
  }
}
export class NotFoundError extends AppError {
  constructor(what = 'That') {
    super(404, 'not_found', `${what} was not found.`);
  }
}
export class ConflictError extends AppError {
  constructor(message: string, field?: string) {
    super(409, 'conflict', message, field);
  }
}

/** Refused for now (busy, over a limit): the error middleware sends `Retry-After` with it (RFC 9110 §10.2.3). */
export class RetryLaterError extends AppError {
  constructor(status: number, code: string, message: string, readonly retryAfterS: number) {
    super(status, code, message);
  }
}
