import { describe, expect, it } from 'vitest'
import {
  matchingStep,
  newRecoveryCodes,
  newTotpSecret,
  recoveryCodeHash,
} from '../../server/auth/totp'
import { base32Bytes, base32Of, hotp, totpCode } from '../helpers/totp-code'

// RFC 6238 Appendix B: the shared secret is the ASCII text "12345678901234567890" (SHA-1 mode),
// T0 = 0, X = 30 s, 8-digit codes. Times in seconds since the Unix epoch.
const RFC6238_SECRET = base32Of(Buffer.from('12345678901234567890', 'ascii'))
const RFC6238_SHA1 = [
  { seconds: 59, code: '94287082' },
  { seconds: 1111111109, code: '07081804' },
  { seconds: 1111111111, code: '14050471' },
  { seconds: 1234567890, code: '89005924' },
  { seconds: 2000000000, code: '69279037' },
  { seconds: 20000000000, code: '65353130' },
]

describe('the tests’ own code generator (tests/helpers/totp-code.ts)', () => {
  it('gives the RFC 6238 Appendix B SHA-1 codes', () => {
    for (const { seconds, code } of RFC6238_SHA1) {
      expect(totpCode(RFC6238_SECRET, seconds * 1000, 8), String(seconds)).toBe(code)
    }
  })

  it('reads base32 back to the bytes it was made from (RFC 4648 section 6)', () => {
    // RFC 4648 section 10 test vector: BASE32("foobar") = "MZXW6YTBOI======"
    expect(base32Of(Buffer.from('foobar'))).toBe('MZXW6YTBOI')
    expect(base32Bytes('MZXW6YTBOI======').toString()).toBe('foobar')
  })

  it('gives the RFC 4226 Appendix D HOTP values for counters 0 and 1', () => {
    const key = Buffer.from('12345678901234567890', 'ascii')
    expect(hotp(key, 0)).toBe('755224')
    expect(hotp(key, 1)).toBe('287082')
  })
})

describe('the server’s code check (server/auth/totp.ts, the otpauth package)', () => {
  it('accepts the RFC 6238 vectors (their last six digits) at their time, naming the step', () => {
    for (const { seconds, code } of RFC6238_SHA1) {
      const step = Math.floor(seconds / 30)
      expect(matchingStep(RFC6238_SECRET, code.slice(2), seconds * 1000), String(seconds)).toBe(
        step,
      )
    }
  })

  it('allows one step of clock drift either side, and no more', () => {
    const secret = newTotpSecret()
    const now = 1_700_000_000_000
    const step = Math.floor(now / 30_000)
    expect(matchingStep(secret, totpCode(secret, now - 30_000), now)).toBe(step - 1)
    expect(matchingStep(secret, totpCode(secret, now + 30_000), now)).toBe(step + 1)
    expect(matchingStep(secret, totpCode(secret, now - 90_000), now)).toBeUndefined()
    expect(matchingStep(secret, totpCode(secret, now + 90_000), now)).toBeUndefined()
  })

  it('makes 160-bit keys (RFC 4226 section 4) and ten distinct recovery codes', () => {
    const secret = newTotpSecret()
    expect(base32Bytes(secret)).toHaveLength(20)
    const codes = newRecoveryCodes()
    expect(new Set(codes).size).toBe(10)
    for (const code of codes) expect(code).toMatch(/^[a-z2-9]{5}-[a-z2-9]{5}$/)
    expect(recoveryCodeHash(codes[0]!.toUpperCase().replace('-', ' '))).toBe(
      recoveryCodeHash(codes[0]!),
    )
  })
})
