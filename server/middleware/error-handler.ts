import type { ErrorRequestHandler, RequestHandler } from 'express'
import { AppError, NotFound, ValidationError } from '../errors'

export const apiNotFound: RequestHandler = (req, _res, next) => {
  next(new NotFound(`No API route for ${req.method} ${req.baseUrl}${req.path}.`))
}

interface HttpError {
  status?: number
  statusCode?: number
  type?: string
}

/** body-parser and friends throw errors with an HTTP status; keep their meaning, not their text. */
function fromHttpError(error: HttpError): AppError | undefined {
  const status = error.status ?? error.statusCode
  if (!status || status < 400 || status >= 500) return undefined
  if (error.type === 'entity.too.large') {
    return new AppError('payload_too_large', 'The request body is too large.')
  }
  if (error.type === 'entity.parse.failed') {
    return new ValidationError(
      'The request body is not valid JSON: send an application/json object.',
    )
  }
  if (error.type === 'charset.unsupported' || error.type === 'encoding.unsupported') {
    return new ValidationError('The request body must be an application/json object in UTF-8.')
  }
  return new ValidationError('The request could not be processed.')
}

export function errorHandler(log: (error: unknown) => void): ErrorRequestHandler {
  return (error: unknown, _req, res, _next) => {
    const known =
      error instanceof AppError
        ? error
        : typeof error === 'object' && error !== null
          ? fromHttpError(error as HttpError)
          : undefined
    if (known) {
      // a refusal of ours above 499 (a failed integrity check) still needs an operator's eye
      if (known.status >= 500) log(error)
      const body = { code: known.code, message: known.message, details: known.details }
      res.status(known.status).json({ error: body })
      return
    }
    log(error)
    res.status(500).json({ error: { code: 'internal_error', message: 'Something went wrong.' } })
  }
}
