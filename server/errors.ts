/** Errors a service throws on purpose; the error middleware turns them into JSON answers. */
export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly details?: unknown,
  ) {
    super(message)
  }
}

export class ValidationError extends AppError {
  constructor(message: string, details?: unknown) {
    super(400, 'validation_failed', message, details)
  }
}

export class Unauthorized extends AppError {
  constructor(message = 'Please sign in.') {
    super(401, 'unauthorized', message)
  }
}

export class Forbidden extends AppError {
  constructor(message = 'You are not allowed to do that.') {
    super(403, 'forbidden', message)
  }
}

export class NotFound extends AppError {
  constructor(message = 'Not found.') {
    super(404, 'not_found', message)
  }
}

export class Conflict extends AppError {
  constructor(message: string, details?: unknown) {
    super(409, 'conflict', message, details)
  }
}

export class TooManyRequests extends AppError {
  constructor(message = 'Too many attempts. Please wait and try again.') {
    super(429, 'too_many_requests', message)
  }
}
