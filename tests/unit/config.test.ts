import { describe, expect, it } from 'vitest'
import { ConfigError, loadConfig } from '../../server/config'

describe('configuration from the environment', () => {
  it('defaults to loopback on port 3000, and to no demo data unless asked for', () => {
    const config = loadConfig({})
    expect(config.host).toBe('127.0.0.1')
    expect(config.port).toBe(3000)
    expect(config.demoData).toBe(false)
    expect(loadConfig({ DEMO_DATA: 'true' }).demoData).toBe(true)
  })

  it('links out through PUBLIC_URL, by default the listening address', () => {
    expect(loadConfig({}).publicUrl).toBe('http://127.0.0.1:3000')
    expect(loadConfig({ HOST: '0.0.0.0', PORT: '8080' }).publicUrl).toBe('http://0.0.0.0:8080')
    expect(loadConfig({ HOST: '::1' }).publicUrl).toBe('http://[::1]:3000')
    const behindProxy = loadConfig({ PUBLIC_URL: 'https://lab.example/fractolog/' })
    expect(behindProxy.publicUrl).toBe('https://lab.example/fractolog')
    expect(() => loadConfig({ PUBLIC_URL: 'lab.example' })).toThrow(
      /^Configuration error: PUBLIC_URL/,
    )
    expect(() => loadConfig({ PUBLIC_URL: 'ftp://lab.example' })).toThrow(/PUBLIC_URL/)
  })

  it('never seeds demo data in production', () => {
    const config = loadConfig({
      NODE_ENV: 'production',
      SESSION_SECRET: 's'.repeat(40),
      DEMO_DATA: 'true',
    })
    expect(config.demoData).toBe(false)
  })

  it('stops with one line naming a bad variable', () => {
    expect(() => loadConfig({ PORT: 'eighty' })).toThrow(ConfigError)
    expect(() => loadConfig({ PORT: 'eighty' })).toThrow(/^Configuration error: PORT/)
    expect(() => loadConfig({ DATABASE_URL: 'postgres://x@y/z' })).toThrow(/DATABASE_URL/)
  })

  it('requires a session secret in production', () => {
    expect(() => loadConfig({ NODE_ENV: 'production' })).toThrow(/SESSION_SECRET/)
  })

  it('refuses a password cost below the OWASP figure (scrypt N = 2^17) in production', () => {
    // OWASP Password Storage Cheat Sheet: scrypt N=2^17, r=8, p=1 at least
    const production = { NODE_ENV: 'production', SESSION_SECRET: 's'.repeat(40) }
    expect(() => loadConfig({ ...production, PASSWORD_COST: '16' })).toThrow(/PASSWORD_COST/)
    expect(loadConfig({ ...production, PASSWORD_COST: '17' }).passwordCost).toBe(17)
    expect(loadConfig({ PASSWORD_COST: '12' }).passwordCost).toBe(12)
  })

  it('trusts X-Forwarded-For from loopback only unless TRUST_PROXY says otherwise', () => {
    expect(loadConfig({}).trustProxy).toBe('loopback')
    expect(loadConfig({ TRUST_PROXY: 'false' }).trustProxy).toBe(false)
    expect(loadConfig({ TRUST_PROXY: '2' }).trustProxy).toBe(2)
    expect(loadConfig({ TRUST_PROXY: '10.0.0.5' }).trustProxy).toBe('10.0.0.5')
  })

  it('gives the demo accounts the shared key FRACTOLOGDEMOKEY unless DEMO_TOTP_SECRET names one', () => {
    expect(loadConfig({}).demoTotpSecret).toBe('FRACTOLOGDEMOKEY')
    expect(loadConfig({ DEMO_TOTP_SECRET: 'JBSWY3DPEHPK3PXP' }).demoTotpSecret).toBe(
      'JBSWY3DPEHPK3PXP',
    )
    expect(() => loadConfig({ DEMO_TOTP_SECRET: 'not base32!' })).toThrow(/DEMO_TOTP_SECRET/)
  })
})
