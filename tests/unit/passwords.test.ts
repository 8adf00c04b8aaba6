import { describe, expect, it } from 'vitest'
import { generateOneTimePassword, hashPassword, verifyPassword } from '../../server/auth/passwords'

describe('password hashing (scrypt)', () => {
  it('verifies the right password and refuses a wrong one', async () => {
    const hash = await hashPassword('a long enough passphrase', 10)
    expect(await verifyPassword('a long enough passphrase', hash)).toBe(true)
    expect(await verifyPassword('a long enough passphrasE', hash)).toBe(false)
  })

  it('records its parameters: OWASP cheat-sheet values N = 2^17, r = 8, p = 1 by default', async () => {
    const hash = await hashPassword('a long enough passphrase')
    expect(hash.split('$').slice(0, 4)).toEqual(['scrypt', String(2 ** 17), '8', '1'])
  })

  it('salts every hash', async () => {
    const first = await hashPassword('same password here', 10)
    const second = await hashPassword('same password here', 10)
    expect(first).not.toBe(second)
  })

  it('refuses a malformed stored hash instead of throwing', async () => {
    expect(await verifyPassword('anything', 'not-a-hash')).toBe(false)
  })

  it('makes one-time passwords of 24 URL-safe characters', () => {
    const password = generateOneTimePassword()
    expect(password).toMatch(/^[A-Za-z0-9_-]{24}$/)
    expect(generateOneTimePassword()).not.toBe(password)
  })
})
