import { loadConfig, type Config } from '../../server/config'

export function testConfig(overrides: Partial<Config> = {}): Config {
  return {
    ...loadConfig({ NODE_ENV: 'test', LOG_REQUESTS: 'false', PASSWORD_COST: '12' }),
    ...overrides,
  }
}
