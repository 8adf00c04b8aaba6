import type { Request, RequestHandler } from 'express'
import { ipKeyGenerator, rateLimit } from 'express-rate-limit'
import type { Config } from '../config'
import { TooManyRequests } from '../errors'

type OnLimited = (req: Request) => Promise<void> | void

function limiter(
  config: Config,
  limit: number,
  keyOf: (req: Request) => string,
  onLimited?: OnLimited,
): RequestHandler {
  return rateLimit({
    windowMs: config.loginLimits.windowMinutes * 60_000,
    limit,
    keyGenerator: keyOf,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    // the address comes from Express's `trust proxy` setting (TRUST_PROXY), checked there
    validate: { trustProxy: false, xForwardedForHeader: false },
    handler: async (req) => {
      await onLimited?.(req)
      throw new TooManyRequests()
    },
  })
}

const byAddress = (req: Request) => `address:${ipKeyGenerator(req.ip ?? '')}`
const bySession = (req: Request) => `session:${req.sessionID}`

/** A password check costs 128 MiB of scrypt: limited per session and per address. */
export function passwordChangeLimits(config: Config, onLimited?: OnLimited): RequestHandler[] {
  const limit = config.passwordChangeLimit
  return [
    limiter(config, limit, bySession, onLimited),
    limiter(config, limit * 3, byAddress, onLimited),
  ]
}

/** Each new visitor's token writes a session row: limited per address (and per session). */
export function csrfTokenLimits(config: Config): RequestHandler[] {
  const limit = config.csrfLimitPerAddress
  return [limiter(config, limit, byAddress), limiter(config, Math.ceil(limit / 4), bySession)]
}
