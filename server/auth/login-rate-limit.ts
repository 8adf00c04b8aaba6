import type { RequestHandler } from 'express'
import { rateLimit } from 'express-rate-limit'
import type { Config } from '../config'
import { TooManyRequests } from '../errors'

function accountKey(body: unknown): string {
  const email = (body as { email?: unknown } | undefined)?.email
  return typeof email === 'string' ? email.trim().toLowerCase() : ''
}

/**
 * Failed sign-ins are counted per account and per address (successful ones are not). The
 * counters live in this process; behind a load balancer each process counts on its own.
 */
export function loginRateLimits(config: Config): RequestHandler[] {
  const { perAccount, perAddress, windowMinutes } = config.loginLimits
  const common = {
    windowMs: windowMinutes * 60_000,
    skipSuccessfulRequests: true,
    standardHeaders: 'draft-8' as const,
    legacyHeaders: false,
    handler: () => {
      throw new TooManyRequests()
    },
  }
  return [
    rateLimit({ ...common, limit: perAddress }),
    rateLimit({
      ...common,
      limit: perAccount,
      skip: (req) => accountKey(req.body) === '',
      keyGenerator: (req) => `account:${accountKey(req.body)}`,
    }),
  ]
}
