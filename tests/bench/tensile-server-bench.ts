import type { Server } from 'node:http'
import type { AddressInfo } from 'node:net'
import { mkdtempSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import path from 'node:path'
import { performance } from 'node:perf_hooks'
import { Worker } from 'node:worker_threads'
import { createApp } from '../../server/app'
import { resolveDatabase } from '../../server/db/database-url'
import { createDb } from '../../server/db/knex'
import { dropAllTables, migrateLatest } from '../../server/db/migrations'
import { createLocalStorage } from '../../server/storage/local-storage'
import { analyseInThread, type TensileAnalyser } from '../../server/tensile/analyse-upload'
import { createAnalysisPool } from '../../server/tensile/analysis-pool'
import { makeCase, makeOrganisation, makePerson } from '../factories'
import { rambergOsgoodCurve, withStressNoise } from '../helpers/tensile/curves'
import { PLAIN_FORMAT, writeRecord } from '../helpers/tensile/dialects'
import { STRUCTURAL_STEEL } from '../helpers/tensile/specimens'
import { signedIn, type ApiSession } from '../helpers/api-session'
import { testConfig } from '../helpers/test-config'

/*
 * Benchmark: while a 1,000,000-point raw record is uploaded and analysed, GET /api/health is
 * asked every 10 ms; its p95 is printed, with the analyses in the worker pool and, for
 * comparison, in the request's thread. Target (issue): p95 under 50 ms with the pool.
 * Runs on the private MariaDB (LOCAL_DB_PORT) in a database of its own. Prints; asserts nothing.
 */
const POINTS = 1_000_000

const percentile = (values: number[], p: number) =>
  [...values].sort((a, b) => a - b)[Math.min(values.length - 1, Math.floor(values.length * p))]!

/*
 * GET /api/health asked every 10 ms from a thread of its own, timed by that thread's clock: a
 * prober on the server's thread would stop asking whenever the server is stalled and so never
 * see the stall.
 */
const PROBE = `
const { parentPort, workerData } = require('node:worker_threads')
const latencies = []
let stopping = false
parentPort.on('message', () => { stopping = true })
;(async () => {
  while (!stopping) {
    const start = performance.now()
    await fetch(workerData.url)
    latencies.push(performance.now() - start)
    await new Promise((done) => setTimeout(done, 10))
  }
  parentPort.postMessage(latencies)
})()
`

function startProber(url: string) {
  const worker = new Worker(PROBE, { eval: true, workerData: { url } })
  return {
    stop: () =>
      new Promise<number[]>((done) => {
        worker.once('message', (latencies: number[]) => {
          void worker.terminate()
          done(latencies)
        })
        worker.postMessage('stop')
      }),
  }
}

/* The upload is sent from a thread of its own too, so the client's work is not the server's. */
const UPLOAD = `
const { parentPort, workerData } = require('node:worker_threads')
const form = new FormData()
form.append('file', new Blob([workerData.bytes]), 'bench.csv')
fetch(workerData.url, { method: 'POST', body: form, headers: workerData.headers }).then(
  (response) => parentPort.postMessage(response.status),
  (error) => parentPort.postMessage(String(error)),
)
`

function uploadFromAnotherThread(url: string, bytes: Buffer, headers: Record<string, string>) {
  const worker = new Worker(UPLOAD, { eval: true, workerData: { url, bytes, headers } })
  return new Promise<number | string>((done) => {
    worker.once('message', (status: number | string) => {
      void worker.terminate()
      done(status)
    })
  })
}

/** The session's cookies as a Cookie header, to send them from the upload thread. */
function cookieOf(session: ApiSession): string {
  type Jar = { getCookies(access: object): { name: string; value: string }[] }
  const jar = (session.agent as unknown as { jar: Jar }).jar
  return jar
    .getCookies({ domain: '127.0.0.1', path: '/', secure: false, script: false })
    .map((cookie) => `${cookie.name}=${cookie.value}`)
    .join('; ')
}

async function measure(label: string, analyse: TensileAnalyser, bytes: Buffer, url: string) {
  const db = createDb(url)
  await dropAllTables(db)
  await migrateLatest(db)
  const uploads = mkdtempSync(path.join(tmpdir(), 'fractolog-bench-'))
  const app = createApp({
    db,
    config: testConfig(),
    clientDir: '/nonexistent',
    storage: createLocalStorage(uploads),
    analyseTensile: analyse,
  })
  const org = await makeOrganisation(db)
  const lab = await makePerson(db, ['admin'])
  const caseId = (await makeCase(db, org, lab.id)).id
  const session = await signedIn(app, lab.email, lab.password)
  const specimen = await session.post(`/api/cases/${caseId}/specimens`, { label: 'BENCH' })
  const server = await new Promise<Server>((done) => {
    const listening = app.listen(0, '127.0.0.1', () => done(listening))
  })
  const base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`
  const prober = startProber(`${base}/api/health`)
  const started = performance.now()
  const route = `/api/cases/${caseId}/specimens/${specimen.body.data.id}/tensile-records`
  const upload = uploadFromAnotherThread(`${base}${route}`, bytes, {
    cookie: cookieOf(session),
    'x-csrf-token': session.token,
  })
  const status = await upload
  const latencies = await prober.stop()
  const seconds = ((performance.now() - started) / 1000).toFixed(1)
  console.log(
    `${label.padEnd(22)} upload ${status} in ${seconds} s; health asked ${latencies.length} times: ` +
      `p50 ${percentile(latencies, 0.5).toFixed(1)} ms, p95 ${percentile(latencies, 0.95).toFixed(1)} ms, ` +
      `max ${Math.max(...latencies).toFixed(1)} ms`,
  )
  await new Promise((done) => server.close(done))
  await db.destroy()
  rmSync(uploads, { recursive: true, force: true })
}

async function main(): Promise<void> {
  const curve = withStressNoise(
    rambergOsgoodCurve({ ...STRUCTURAL_STEEL, samples: POINTS * 0.8 }),
    0.001,
    7,
  )
  const bytes = Buffer.from(writeRecord(curve, PLAIN_FORMAT))
  console.log(`record: ${curve.strain.length} points, ${(bytes.length / 1e6).toFixed(1)} MB`)
  const database = await resolveDatabase(process.env.BENCH_DATABASE_URL, 'fractolog_bench')
  const pool = createAnalysisPool(1)
  try {
    await measure('worker pool', pool.analyse, bytes, database.url)
    await measure('request thread', analyseInThread, bytes, database.url)
  } finally {
    await pool.close()
    await database.local?.stop()
  }
}

main().catch((error: unknown) => {
  console.error(error)
  process.exit(1)
})
