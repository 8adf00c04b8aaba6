import { loadConfig, type Config } from '../../server/config'

export function testConfig(overrides: Partial<Config> = {}): Config {
  return {
    // the browser tests load many pages from one address: the token limit is checked on its own
    ...loadConfig({
      NODE_ENV: 'test',
      LOG_REQUESTS: 'false',
      PASSWORD_COST: '12',
      CSRF_LIMIT_PER_ADDRESS: '100000',
    }),
    ...overrides,
  }
}
