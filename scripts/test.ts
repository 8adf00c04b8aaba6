// `npm test`: static checks, then unit, API and browser tests on a private MariaDB (or on
// TEST_DATABASE_URL), then a one-line summary. Stops only the database it started.
import { mkdirSync, readFileSync, rmSync } from 'node:fs'
import { resolveDatabase, type ResolvedDatabase } from '../server/db/database-url'
import { ensureChromium } from './ensure-chromium'
import { ensurePoppler } from './ensure-poppler'
import { runStep } from './run-step'

const RESULTS_DIR = '.data/test-results'
const npx = 'npx'

const staticChecks: [string, string[]][] = [
  ['eslint', ['.']],
  ['prettier', ['--check', '.']],
  ['vue-tsc', ['--build', '--force']],
  ['vite', ['build', '--logLevel', 'warn']],
  ['tsx', ['scripts/build-server.ts']],
]

interface Counts {
  passed: number
  failed: number
}

function readCounts(project: string): Counts {
  try {
    const report = JSON.parse(readFileSync(`${RESULTS_DIR}/${project}.json`, 'utf8')) as {
      numPassedTests: number
      numFailedTests: number
    }
    return { passed: report.numPassedTests, failed: report.numFailedTests }
  } catch {
    return { passed: 0, failed: 1 }
  }
}

async function runProjects(env: NodeJS.ProcessEnv): Promise<Counts> {
  const total: Counts = { passed: 0, failed: 0 }
  for (const project of ['unit', 'api', 'e2e']) {
    console.log(`\n— ${project} tests —`)
    const code = await runStep(
      npx,
      [
        'vitest',
        'run',
        '--project',
        project,
        '--reporter=default',
        '--reporter=json',
        `--outputFile.json=${RESULTS_DIR}/${project}.json`,
      ],
      env,
    )
    const counts = readCounts(project)
    total.passed += counts.passed
    total.failed += counts.failed + (code !== 0 && counts.failed === 0 ? 1 : 0)
  }
  return total
}

/**
 * Each test database has two accounts: the owner (migrations, resets: TEST_DATABASE_URL,
 * E2E_DATABASE_URL) and the application's (TEST_APP_DATABASE_URL, E2E_APP_DATABASE_URL), which
 * the global set-ups grant its tables after migrating, as `npm start` does.
 */
async function databases(): Promise<{ env: NodeJS.ProcessEnv; local: ResolvedDatabase['local'] }> {
  const owner = process.env.TEST_DATABASE_URL
  const given = {
    url: process.env.TEST_APP_DATABASE_URL ?? owner,
    ownerUrl: owner,
    applicationHost: process.env.DATABASE_APP_HOST,
  }
  const api = await resolveDatabase(given, 'fractolog_test')
  const e2e = await resolveDatabase(given, 'fractolog_e2e')
  const env = {
    ...process.env,
    TEST_DATABASE_URL: api.url,
    TEST_APP_DATABASE_URL: api.appUrl,
    E2E_DATABASE_URL: e2e.url,
    E2E_APP_DATABASE_URL: e2e.appUrl,
    ...(api.applicationAccount ? { TEST_APP_DATABASE_HOST: api.applicationAccount.host } : {}),
  }
  return { env, local: api.local ?? e2e.local }
}

async function main(): Promise<number> {
  for (const [command, args] of staticChecks) {
    console.log(`\n— ${command} ${args.join(' ')} —`)
    if ((await runStep(npx, [command, ...args])) !== 0) return 1
  }
  ensureChromium()
  ensurePoppler()
  rmSync(RESULTS_DIR, { recursive: true, force: true })
  mkdirSync(RESULTS_DIR, { recursive: true })
  const { env, local } = await databases()
  const stop = async () => {
    if (local) await local.stop()
  }
  process.once('SIGINT', () => void stop().then(() => process.exit(130)))
  process.once('SIGTERM', () => void stop().then(() => process.exit(143)))
  try {
    const total = await runProjects(env)
    console.log(`\nSummary: ${total.passed} passed, ${total.failed} failed`)
    return total.failed === 0 ? 0 : 1
  } finally {
    await stop()
  }
}

main().then(
  (code) => process.exit(code),
  (error: unknown) => {
    console.error(error instanceof Error ? error.message : String(error))
    process.exit(1)
  },
)
