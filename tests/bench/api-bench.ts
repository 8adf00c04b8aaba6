import { spawn, type ChildProcess } from 'node:child_process'
import { createServer } from 'node:net'
import autocannon from 'autocannon'
import { createDb } from '../../server/db/knex'
import { DEFAULT_DEMO_TOTP_SECRET } from '../../seeds/demo'
import { totpCode } from '../helpers/totp-code'
import { resolveDatabase } from '../../server/db/database-url'
import { runStep } from '../../scripts/run-step'
import { BENCH_PASSWORD, seedBenchData } from './api-bench-seed'
import { explainRequest } from './api-bench-explain'

/*
 * Benchmark: `GET /api/cases` (first page, a search, a filtered page, a client's view) and
 * `GET /api/cases/:id` on 10,000 cases in a private benchmark database, against the compiled
 * server, beside a bare mysql2 floor (bare-floor-server.ts) at the same concurrency. Prints
 * requests per second, p50/p95/p99, the ratios, the statements per request and MariaDB's plans.
 * `--duration N` (seconds per run, default 20). Prints figures; asserts nothing.
 */
const CASES = 10_000
const CONNECTIONS = 32
const durationFlag = process.argv.indexOf('--duration')
const DURATION = durationFlag > 0 ? Number(process.argv[durationFlag + 1]) : 20

interface Scenario {
  name: string
  paths: string[]
  who: 'staff' | 'client'
}

interface Measured {
  perSecond: number
  p50: number
  p95: number
  p99: number
  failures: number
}

function freePort(): Promise<number> {
  return new Promise((done, reject) => {
    const probe = createServer().listen(0, '127.0.0.1', () => {
      const { port } = probe.address() as { port: number }
      probe.close(() => done(port))
    })
    probe.once('error', reject)
  })
}

function startChild(command: string, args: string[], env: NodeJS.ProcessEnv, ready: RegExp) {
  const child = spawn(command, args, {
    env: { ...process.env, ...env },
    stdio: ['ignore', 'pipe', 'inherit'],
  })
  return new Promise<ChildProcess>((done, reject) => {
    child.stdout?.on('data', (chunk: Buffer) => {
      if (ready.test(chunk.toString())) done(child)
    })
    child.once('exit', (code) => reject(new Error(`${args.join(' ')} exited with ${code}`)))
  })
}

const cookiesOf = (response: Response) =>
  response.headers
    .getSetCookie()
    .map((line) => line.split(';')[0])
    .join('; ')

async function tokenFor(base: string, cookie: string): Promise<{ token: string; cookie: string }> {
  const csrf = await fetch(`${base}/api/auth/csrf`, { headers: cookie ? { Cookie: cookie } : {} })
  const { data } = (await csrf.json()) as { data: { token: string } }
  return { token: data.token, cookie: cookiesOf(csrf) || cookie }
}

async function post(base: string, path: string, cookie: string, body: object) {
  const { token, cookie: current } = await tokenFor(base, cookie)
  const response = await fetch(`${base}${path}`, {
    method: 'POST',
    headers: { 'Content-Type': 'application/json', 'X-CSRF-Token': token, Cookie: current },
    body: JSON.stringify(body),
  })
  if (response.status !== 200) throw new Error(`${path} for the bench answered ${response.status}`)
  return { response, cookie: cookiesOf(response) || current }
}

/** Password, then the demo accounts' shared second-factor key (RFC 6238 code). */
async function signIn(base: string, email: string): Promise<string> {
  const login = await post(base, '/api/auth/login', '', { email, password: BENCH_PASSWORD })
  const answer = (await login.response.json()) as { data: { secondFactorRequired?: boolean } }
  if (!answer.data.secondFactorRequired) return login.cookie
  const code = totpCode(DEFAULT_DEMO_TOTP_SECRET)
  return (await post(base, '/api/auth/second-factor', login.cookie, { code })).cookie
}

function percentile(sorted: number[], share: number): number {
  return sorted[Math.min(sorted.length - 1, Math.floor(sorted.length * share))] ?? NaN
}

function load(base: string, paths: string[], cookie: string): Promise<Measured> {
  const times: number[] = []
  let next = 0
  return new Promise((done, reject) => {
    const tracker = autocannon(
      {
        url: base,
        connections: CONNECTIONS,
        duration: DURATION,
        headers: { cookie, accept: 'application/json' },
        requests: [{ setupRequest: (req) => ({ ...req, path: paths[next++ % paths.length] }) }],
      },
      (error, result) => {
        if (error) return reject(error)
        times.sort((a, b) => a - b)
        done({
          perSecond: result.requests.average,
          p50: percentile(times, 0.5),
          p95: percentile(times, 0.95),
          p99: percentile(times, 0.99),
          failures: result.non2xx + result.errors + result.timeouts,
        })
      },
    )
    tracker.on('response', (_client, _status, _bytes, responseTime: number) =>
      times.push(responseTime),
    )
  })
}

const row = (label: string, m: Measured) =>
  `  ${label.padEnd(6)}${m.perSecond.toFixed(0).padStart(8)} req/s   p50 ${m.p50.toFixed(1).padStart(7)} ms   p95 ${m.p95.toFixed(1).padStart(7)} ms   p99 ${m.p99.toFixed(1).padStart(7)} ms${m.failures ? `   ${m.failures} failed` : ''}`

async function main(): Promise<void> {
  if ((await runStep('npx', ['tsx', 'scripts/build-server.ts'])) !== 0) process.exit(1)
  const database = await resolveDatabase(process.env.BENCH_DATABASE_URL, 'fractolog_bench')
  const db = createDb(database.url, { min: 0, max: 4 })
  const children: ChildProcess[] = []
  try {
    console.log(`seeded ${await seedBenchData(db, CASES)} cases`)
    const [apiPort, floorPort] = [await freePort(), await freePort()]
    const env = { DATABASE_URL: database.url, HOST: '127.0.0.1', LOG_REQUESTS: 'false' }
    children.push(
      await startChild(
        process.execPath,
        ['dist-server/server.js'],
        { ...env, PORT: String(apiPort) },
        /running at/,
      ),
    )
    children.push(
      await startChild(
        process.execPath,
        ['--import', 'tsx', 'tests/bench/bare-floor-server.ts'],
        { ...env, PORT: String(floorPort) },
        /ready/,
      ),
    )
    const api = `http://127.0.0.1:${apiPort}`
    const floor = `http://127.0.0.1:${floorPort}`
    const cookies = {
      staff: await signIn(api, 'investigator@demo.test'),
      client: await signIn(api, 'client@demo.test'),
    }
    const caseIds = (await db('cases').orderBy('id', 'desc').limit(200).pluck('id')) as number[]
    const scenarios: Scenario[] = [
      { name: 'first page', paths: ['/api/cases'], who: 'staff' },
      { name: 'search "sheave"', paths: ['/api/cases?q=sheave'], who: 'staff' },
      {
        name: 'filtered page (examination, page 3)',
        paths: ['/api/cases?status=examination&page=3'],
        who: 'staff',
      },
      { name: "a client's view", paths: ['/api/cases'], who: 'client' },
      { name: 'one case by id', paths: caseIds.map((id) => `/api/cases/${id}`), who: 'staff' },
    ]
    console.log(
      `${CONNECTIONS} connections, ${DURATION} s per run; API = compiled server, floor = bare mysql2\n`,
    )
    for (const scenario of scenarios) {
      const cookie = cookies[scenario.who]
      const measuredApi = await load(api, scenario.paths, cookie)
      const measuredFloor = await load(floor, scenario.paths, cookie)
      const { statements, plans } = await explainRequest(db, scenario.paths[0] ?? '/', cookie)
      console.log(
        `${scenario.name}   (${scenario.paths[0]}${scenario.paths.length > 1 ? ' …' : ''})`,
      )
      console.log(row('API', measuredApi))
      console.log(row('floor', measuredFloor))
      const ratio = measuredApi.p95 / measuredFloor.p95
      const share = measuredApi.perSecond / measuredFloor.perSecond
      console.log(
        `  API p95 = ${ratio.toFixed(2)} × floor; API req/s = ${share.toFixed(2)} × floor; ${statements.length} statements per API request`,
      )
      console.log(plans.join('\n'), '\n')
    }
  } finally {
    for (const child of children) child.kill('SIGTERM')
    await db.destroy()
    await database.local?.stop()
  }
}

main().then(
  () => process.exit(0),
  (error: unknown) => {
    console.error(error instanceof Error ? error.message : String(error))
    process.exit(1)
  },
)
