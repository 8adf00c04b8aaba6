import type { Request } from 'express'
import { IDEMPOTENCY_HEADER, IDEMPOTENCY_KEY_PATTERN } from '../../shared/api/idempotency'
import { ValidationError } from '../errors'

/** The request's Idempotency-Key, if it sent one; a malformed key is refused, never ignored. */
export function idempotencyKeyOf(req: Request): string | undefined {
  const key = req.get(IDEMPOTENCY_HEADER)
  if (key === undefined) return undefined
  if (IDEMPOTENCY_KEY_PATTERN.test(key)) return key
  const message = 'Use 1 to 191 visible ASCII characters without spaces, such as a UUID.'
  throw new ValidationError(`Invalid ${IDEMPOTENCY_HEADER} header. ${message}`, [
    { path: IDEMPOTENCY_HEADER, message },
  ])
}
