import { defineConfig } from 'vitest/config'

// Three projects: pure unit tests, API tests against the real MariaDB, and browser journeys in
// Debian's Chromium. scripts/test.ts starts the database before running them. The time bounds
// only catch a hang: on a busy two-core machine a scrypt hash or a page load takes many times
// longer than on a quiet one, and speed is measured in the benchmarks instead.
export default defineConfig({
  test: {
    projects: [
      {
        test: {
          name: 'unit',
          include: ['tests/unit/**/*.test.ts'],
          environment: 'node',
          testTimeout: 30_000,
        },
      },
      {
        test: {
          name: 'api',
          include: ['tests/api/**/*.test.ts'],
          environment: 'node',
          globalSetup: ['tests/helpers/api-global-setup.ts'],
          fileParallelism: false,
          testTimeout: 60_000,
          hookTimeout: 120_000,
        },
      },
      {
        test: {
          name: 'e2e',
          include: ['tests/e2e/**/*.test.ts'],
          // a busy machine can take seconds to load a page; polls wait that long before failing
          expect: { poll: { timeout: 20_000 } },
          environment: 'node',
          globalSetup: ['tests/helpers/e2e-global-setup.ts'],
          fileParallelism: false,
          testTimeout: 180_000,
          hookTimeout: 180_000,
        },
      },
    ],
  },
})
