import type { ErrorRequestHandler, Request, RequestHandler } from 'express'
import { isDatabaseUnavailable, outageLogger } from '../db/availability'
import { AppError, DatabaseUnavailable, HiddenNotFound, NotFound, ValidationError } from '../errors'

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

function knownError(error: unknown): AppError | undefined {
  if (error instanceof AppError) return error
  if (isDatabaseUnavailable(error)) return new DatabaseUnavailable()
  if (typeof error === 'object' && error !== null) return fromHttpError(error as HttpError)
  return undefined
}

/** Notes a refusal on the security trail before it is answered (403s and hidden cases). */
export type RefusalRecorder = (req: Request, refusal: AppError) => Promise<void>

/** Refusals the security trail keeps: forbidden actions, bad security tokens, hidden cases. */
export function isRecordedRefusal(error: AppError): boolean {
  return (
    error.code === 'forbidden' || error.code === 'csrf_invalid' || error instanceof HiddenNotFound
  )
}

export function errorHandler(
  log: (error: unknown) => void,
  recordRefusal?: RefusalRecorder,
): ErrorRequestHandler {
  const logOutage = outageLogger((message) => log(message))
  const answer = answerError(log, logOutage)
  return (error: unknown, req, res, next) => {
    const known = knownError(error)
    if (!recordRefusal || !known || !isRecordedRefusal(known)) return answer(error, req, res, next)
    recordRefusal(req, known).then(
      () => answer(error, req, res, next),
      (recordError: unknown) => answer(recordError, req, res, next),
    )
  }
}

function answerError(
  log: (error: unknown) => void,
  logOutage: (error: unknown) => void,
): ErrorRequestHandler {
  return (error: unknown, _req, res, _next) => {
    const known = knownError(error)
    if (known?.code === 'database_unavailable') logOutage(error)
    // a refusal of ours above 499 (a failed integrity check) still needs an operator's eye
    else if (!known || known.status >= 500) log(error)
    // e.g. the session could not be saved after the answer went out: nothing more to say
    if (res.headersSent) return
    if (!known) {
      res.status(500).json({ error: { code: 'internal_error', message: 'Something went wrong.' } })
      return
    }
    if (known.code === 'database_unavailable') res.set('Retry-After', '5')
    const body = { code: known.code, message: known.message, details: known.details }
    res.status(known.status).json({ error: body })
  }
}
