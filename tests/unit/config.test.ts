import { describe, expect, it } from 'vitest'
import { ConfigError, loadConfig } from '../../server/config'

describe('configuration from the environment', () => {
  it('defaults to loopback on port 3000 with demo data outside production', () => {
    const config = loadConfig({})
    expect(config.host).toBe('127.0.0.1')
    expect(config.port).toBe(3000)
    expect(config.demoData).toBe(true)
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
})
