import { randomBytes, scrypt, timingSafeEqual, type ScryptOptions } from 'node:crypto'

// scrypt at the OWASP Password Storage Cheat Sheet parameters (N = 2^17, r = 8, p = 1); the cost
// exponent is configurable so tests can hash quickly. Each hash records its own parameters.
const KEY_LENGTH = 32

function derive(password: string, salt: Buffer, options: ScryptOptions): Promise<Buffer> {
  return new Promise((resolve, reject) => {
    scrypt(password.normalize('NFKC'), salt, KEY_LENGTH, options, (error, key) =>
      error ? reject(error) : resolve(key),
    )
  })
}

const memoryFor = (N: number, r: number) => 256 * N * r

export async function hashPassword(password: string, costExponent = 17): Promise<string> {
  const N = 2 ** costExponent
  const r = 8
  const p = 1
  const salt = randomBytes(16)
  const key = await derive(password, salt, { N, r, p, maxmem: memoryFor(N, r) })
  return ['scrypt', N, r, p, salt.toString('base64'), key.toString('base64')].join('$')
}

export async function verifyPassword(password: string, stored: string): Promise<boolean> {
  const [scheme, n, r, p, salt, key] = stored.split('$')
  if (scheme !== 'scrypt' || !n || !r || !p || !salt || !key) return false
  const expected = Buffer.from(key, 'base64')
  const options = {
    N: Number(n),
    r: Number(r),
    p: Number(p),
    maxmem: memoryFor(Number(n), Number(r)),
  }
  const actual = await derive(password, Buffer.from(salt, 'base64'), options)
  return actual.length === expected.length && timingSafeEqual(actual, expected)
}

/** A one-time password an administrator hands over; 18 random bytes read as base64url. */
export function generateOneTimePassword(): string {
  return randomBytes(18).toString('base64url')
}
