import { spawn, type ChildProcess } from 'node:child_process'
import { resolve } from 'node:path'
import { fileURLToPath } from 'node:url'
import { freePort } from './own-mariadb'

const repoRoot = resolve(fileURLToPath(import.meta.url), '../../..')

export interface ServerProcess {
  url: string
  child: ChildProcess
  /** everything the process wrote to stdout and stderr so far */
  output: () => string
  alive: () => boolean
  /** resolves with the exit code (or signal) once the process has ended */
  exited: Promise<number | NodeJS.Signals | null>
}

/**
 * The real server entry (server/index.ts) in a process of its own, against `databaseUrl`, so a
 * test can watch whether the process survives what happens to it. `uploadsDir` must be a folder
 * of the test's own: at start the server removes every file there that its database does not name.
 */
export async function startServerProcess(
  databaseUrl: string,
  uploadsDir: string,
  env: NodeJS.ProcessEnv = {},
  /** `bare`: nothing but PATH and the address, database and folder (no demo settings at all) */
  options: { bare?: boolean } = {},
): Promise<ServerProcess> {
  const port = await freePort()
  const inherited = options.bare
    ? { PATH: process.env.PATH }
    : { ...process.env, DEMO_DATA: 'false', PASSWORD_COST: '10' }
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
    cwd: repoRoot,
    env: {
      ...inherited,
      NODE_ENV: 'development',
      HOST: '127.0.0.1',
      PORT: String(port),
      DATABASE_URL: databaseUrl,
      UPLOADS_DIR: uploadsDir,
      LOG_REQUESTS: 'false',
      ...env,
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  })
  let output = ''
  child.stdout?.on('data', (chunk: Buffer) => (output += chunk.toString()))
  child.stderr?.on('data', (chunk: Buffer) => (output += chunk.toString()))
  const exited = new Promise<number | NodeJS.Signals | null>((done) =>
    child.once('exit', (code, signal) => done(code ?? signal)),
  )
  const url = `http://127.0.0.1:${port}`
  await waitForListening(url, () => output, exited)
  return {
    url,
    child,
    output: () => output,
    alive: () => child.exitCode === null && child.signalCode === null,
    exited,
  }
}

async function waitForListening(
  url: string,
  output: () => string,
  exited: Promise<unknown>,
  timeoutMs = 30_000,
): Promise<void> {
  let ended = false
  void exited.then(() => (ended = true))
  const deadline = Date.now() + timeoutMs
  while (Date.now() < deadline && !ended) {
    if (output().includes('Fractolog is running at')) return
    await new Promise((done) => setTimeout(done, 100))
  }
  throw new Error(`The server did not start at ${url}:\n${output()}`)
}
