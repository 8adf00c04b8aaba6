import { createHash, randomBytes } from 'node:crypto'
import { Secret, TOTP } from 'otpauth'

// Time-based one-time codes (RFC 6238): SHA-1, 6 digits, 30-second steps, as authenticator apps
// expect. One step either side is accepted for clock drift.
const PERIOD_SECONDS = 30
const DRIFT_STEPS = 1
const ISSUER = 'Fractolog'

function totpOf(secret: string, label = ''): TOTP {
  return new TOTP({
    issuer: ISSUER,
    label,
    algorithm: 'SHA1',
    digits: 6,
    period: PERIOD_SECONDS,
    secret: Secret.fromBase32(secret),
  })
}

/** A new random key, 160 bits as RFC 4226 recommends, in base32. */
export function newTotpSecret(): string {
  return new Secret({ size: 20 }).base32
}

/** The otpauth:// address an authenticator app reads from the QR code. */
export function totpUri(secret: string, email: string): string {
  return totpOf(secret, email).toString()
}

/** The time step whose code `code` is, within the drift allowed, or undefined. */
export function matchingStep(secret: string, code: string, now = Date.now()): number | undefined {
  const totp = totpOf(secret)
  const delta = totp.validate({ token: code, timestamp: now, window: DRIFT_STEPS })
  return delta === null ? undefined : totp.counter({ timestamp: now }) + delta
}

// 32 letters and digits without the look-alikes l, o, 0 and 1: each byte picks one without bias
const RECOVERY_ALPHABET = 'abcdefghijkmnpqrstuvwxyz23456789'

/** Ten single-use recovery codes, 10 characters (50 bits) each, shown as xxxxx-xxxxx. */
export function newRecoveryCodes(count = 10): string[] {
  return Array.from({ length: count }, () => {
    const letters = [...randomBytes(10)].map(
      (byte) => RECOVERY_ALPHABET[byte % RECOVERY_ALPHABET.length],
    )
    return `${letters.slice(0, 5).join('')}-${letters.slice(5).join('')}`
  })
}

/** Recovery codes are random, not chosen by people: a plain SHA-256 is enough to store them. */
export function recoveryCodeHash(code: string): string {
  const normalised = code.trim().toLowerCase().replace(/[\s-]/g, '')
  return createHash('sha256').update(normalised).digest('hex')
}
