import { ERROR_STATUS, type ErrorCode } from '../shared/api/errors'

/** Errors a service throws on purpose; the error middleware turns them into JSON answers. */
export class AppError extends Error {
  readonly status: number

  constructor(
    readonly code: ErrorCode,
    message: string,
    readonly details?: unknown,
  ) {
    super(message)
    this.status = ERROR_STATUS[code]
  }
}

export class ValidationError extends AppError {
  constructor(message: string, details?: unknown) {
    super('validation_failed', message, details)
  }
}

export class Unauthorized extends AppError {
  constructor(message = 'Please sign in.') {
    super('unauthenticated', message)
  }
}

export class Forbidden extends AppError {
  constructor(message = 'You are not allowed to do that.') {
    super('forbidden', message)
  }
}

export class NotFound extends AppError {
  constructor(message = 'Not found.') {
    super('not_found', message)
  }
}

/**
 * A case (or a child of one) that exists but lies outside the viewer's scope: answered exactly as
 * a missing one, and written to the security trail as a refused access.
 */
export class HiddenNotFound extends NotFound {
  constructor(
    readonly caseId: number,
    message: string,
  ) {
    super(message)
  }
}

/** A duplicate of something that must be unique. */
export class Conflict extends AppError {
  constructor(message: string, details?: unknown) {
    super('conflict', message, details)
  }
}

export class TooManyRequests extends AppError {
  constructor(message = 'Too many attempts. Please wait and try again.') {
    super('too_many_requests', message)
  }
}

/** MariaDB cannot be reached at the moment; the same request may succeed shortly. */
export class DatabaseUnavailable extends AppError {
  constructor(message = 'The database is not available at the moment. Try again shortly.') {
    super('database_unavailable', message)
  }
}
