import { z } from 'zod'

const booleanFlag = z
  .enum(['true', 'false', '1', '0'])
  .transform((value) => value === 'true' || value === '1')

const ConfigSchema = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
  HOST: z.string().min(1).default('127.0.0.1'),
  PORT: z.coerce.number().int().min(0).max(65535).default(3000),
  DATABASE_URL: z.url({ protocol: /^(mysql|mariadb)$/ }).optional(),
  DATABASE_OWNER_URL: z.url({ protocol: /^(mysql|mariadb)$/ }).optional(),
  DATABASE_APP_HOST: z.string().min(1).optional(),
  TRUST_PROXY: z.string().min(1).default('loopback'),
  SESSION_SECRET: z.string().min(32).optional(),
  DEMO_PASSWORD: z.string().min(8).default('demo-password'),
  DEMO_DATA: booleanFlag.default(false),
  DEMO_TOTP_SECRET: z
    .string()
    .regex(/^[A-Z2-7]{16,64}$/, 'base32 (A–Z, 2–7), 16 to 64 characters')
    .default('FRACTOLOGDEMOKEY'),
  ONE_TIME_PASSWORD_HOURS: z.coerce.number().int().min(1).max(720).default(72),
  PUBLIC_URL: z.url({ protocol: /^https?$/ }).optional(),
  LOG_REQUESTS: booleanFlag.default(true),
  UPLOADS_DIR: z.string().min(1).default('uploads'),
  SESSION_IDLE_MINUTES: z.coerce
    .number()
    .int()
    .min(1)
    .max(24 * 60)
    .default(30),
  SESSION_MAX_HOURS: z.coerce
    .number()
    .int()
    .min(1)
    .max(24 * 7)
    .default(12),
  PASSWORD_COST: z.coerce.number().int().min(10).max(20).default(17),
  LOGIN_LIMIT_PER_ACCOUNT: z.coerce.number().int().min(1).default(5),
  LOGIN_LIMIT_PER_ADDRESS: z.coerce.number().int().min(1).default(30),
  LOGIN_LIMIT_WINDOW_MINUTES: z.coerce.number().int().min(1).default(15),
  SMTP_URL: z.url({ protocol: /^smtps?$/ }).optional(),
  MAIL_FROM: z.string().min(3).default('Fractolog <notices@fractolog.invalid>'),
  MAIL_RETRY_MINUTES: z
    .string()
    .regex(/^\d+(\.\d+)?(,\d+(\.\d+)?)*$/, 'a comma-separated list of minutes, e.g. 1,5,30,60')
    .default('1,5,30,60'),
  MAIL_GIVE_UP_HOURS: z.coerce.number().positive().default(24),
  MAIL_POLL_SECONDS: z.coerce.number().positive().default(5),
  LOGIN_DELAY_MAX_SECONDS: z.coerce.number().min(0).max(60).default(8),
  PASSWORD_CHANGE_LIMIT: z.coerce.number().int().min(1).default(10),
  CSRF_LIMIT_PER_ADDRESS: z.coerce.number().int().min(1).default(600),
})

/** OWASP Password Storage Cheat Sheet: scrypt with N = 2^17 at least. */
export const PRODUCTION_MIN_PASSWORD_COST = 17

export type Config = {
  nodeEnv: 'development' | 'production' | 'test'
  host: string
  port: number
  databaseUrl: string | undefined
  /** the owner's account for migrations and grants (DATABASE_URL's account is the application's) */
  databaseOwnerUrl: string | undefined
  databaseAppHost: string | undefined
  /** Express's `trust proxy`: which senders may name the client in X-Forwarded-For */
  trustProxy: boolean | number | string
  /** where people reach the product: the base of links that leave it (e-mail, labels) */
  publicUrl: string
  sessionSecret: string
  demoPassword: string
  /** `npm start` seeds the demo only when asked (it asks by default); never in production */
  demoData: boolean
  /** the shared second-factor key of the demo accounts (base32) */
  demoTotpSecret: string
  /** how long an administrator's one-time password stays valid */
  oneTimePasswordHours: number
  logRequests: boolean
  uploadsDir: string
  sessionIdleMinutes: number
  sessionMaxHours: number
  /** scrypt cost exponent: N = 2^passwordCost (17 is the OWASP recommendation) */
  passwordCost: number
  /**
   * Failed sign-ins (and second-factor codes): `perAccount` per account from one address and
   * `perAddress` from one address are refused with 429; failures for an account from anywhere
   * only slow its sign-ins down, up to `delayMaxSeconds`, so nobody can lock its owner out.
   */
  loginLimits: {
    perAccount: number
    perAddress: number
    windowMinutes: number
    delayMaxSeconds: number
  }
  /** attempts at changing one's password per session and per address in the window */
  passwordChangeLimit: number
  /** security-token requests per address in the window (each new visitor's writes a session) */
  csrfLimitPerAddress: number
  mail: MailConfig
}

export interface MailConfig {
  /** where the sender delivers; unset: notices wait in the outbox */
  smtpUrl: string | undefined
  from: string
  /** waits between tries, in minutes; the last one repeats */
  retryMinutes: number[]
  /** a message still failing this long after it was queued is given up */
  giveUpHours: number
  /** how often the sender looks for due messages */
  pollSeconds: number
}

export class ConfigError extends Error {}

/** `true`/`false`, a number of hops, or addresses and names as Express takes them. */
function trustProxyOf(text: string): boolean | number | string {
  if (text === 'true' || text === 'false') return text === 'true'
  return /^\d+$/.test(text) ? Number(text) : text
}

/** The listening address as a URL, with an IPv6 host in brackets. */
function listeningUrl(host: string, port: number): string {
  return `http://${host.includes(':') ? `[${host}]` : host}:${port}`
}

/** Reads the environment once; a bad value stops start with one line naming the variable. */
export function loadConfig(env: NodeJS.ProcessEnv = process.env): Config {
  const parsed = ConfigSchema.safeParse(env)
  if (!parsed.success) {
    const issue = parsed.error.issues[0]
    throw new ConfigError(`Configuration error: ${issue?.path.join('.')}: ${issue?.message}`)
  }
  const value = parsed.data
  const production = value.NODE_ENV === 'production'
  if (production && !value.SESSION_SECRET) {
    throw new ConfigError('Configuration error: SESSION_SECRET (32+ characters) is required')
  }
  if (production && value.PASSWORD_COST < PRODUCTION_MIN_PASSWORD_COST) {
    throw new ConfigError(
      `Configuration error: PASSWORD_COST must be at least ${PRODUCTION_MIN_PASSWORD_COST} in production`,
    )
  }
  return {
    nodeEnv: value.NODE_ENV,
    host: value.HOST,
    port: value.PORT,
    databaseUrl: value.DATABASE_URL,
    databaseOwnerUrl: value.DATABASE_OWNER_URL,
    databaseAppHost: value.DATABASE_APP_HOST,
    trustProxy: trustProxyOf(value.TRUST_PROXY),
    publicUrl: (value.PUBLIC_URL ?? listeningUrl(value.HOST, value.PORT)).replace(/\/+$/, ''),
    sessionSecret: value.SESSION_SECRET ?? 'development-only-secret-not-for-production-use',
    demoPassword: value.DEMO_PASSWORD,
    demoData: !production && value.DEMO_DATA,
    demoTotpSecret: value.DEMO_TOTP_SECRET,
    oneTimePasswordHours: value.ONE_TIME_PASSWORD_HOURS,
    logRequests: value.LOG_REQUESTS,
    uploadsDir: value.UPLOADS_DIR,
    sessionIdleMinutes: value.SESSION_IDLE_MINUTES,
    sessionMaxHours: value.SESSION_MAX_HOURS,
    passwordCost: value.PASSWORD_COST,
    loginLimits: {
      perAccount: value.LOGIN_LIMIT_PER_ACCOUNT,
      perAddress: value.LOGIN_LIMIT_PER_ADDRESS,
      windowMinutes: value.LOGIN_LIMIT_WINDOW_MINUTES,
      delayMaxSeconds: value.LOGIN_DELAY_MAX_SECONDS,
    },
    mail: {
      smtpUrl: value.SMTP_URL,
      from: value.MAIL_FROM,
      retryMinutes: value.MAIL_RETRY_MINUTES.split(',').map(Number),
      giveUpHours: value.MAIL_GIVE_UP_HOURS,
      pollSeconds: value.MAIL_POLL_SECONDS,
    },
    passwordChangeLimit: value.PASSWORD_CHANGE_LIMIT,
    csrfLimitPerAddress: value.CSRF_LIMIT_PER_ADDRESS,
  }
}
