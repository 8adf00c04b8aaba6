import { execFile } from 'node:child_process'
import { mkdtempSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join, resolve } from 'node:path'
import { promisify } from 'node:util'
import request from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createApp } from '../../server/app'
import { makePerson } from '../factories'
import { ApiSession, signedIn } from '../helpers/api-session'
import { startServerProcess } from '../helpers/server-process'
import { testConfig } from '../helpers/test-config'
import {
  applicationDatabaseUrl,
  createTestDb,
  resetDatabase,
  testDatabaseUrl,
} from '../helpers/test-db'

const run = promisify(execFile)
const db = createTestDb()
const repoRoot = resolve(import.meta.dirname, '../..')
const uploadsDir = mkdtempSync(join(tmpdir(), 'fractolog-safe-defaults-'))

beforeAll(() => resetDatabase(db))
afterAll(async () => {
  await db.destroy()
  rmSync(uploadsDir, { recursive: true, force: true })
})

describe('a fresh installation', () => {
  it('has no known account when the server starts with an empty environment', async () => {
    const url = applicationDatabaseUrl() ?? testDatabaseUrl()
    const server = await startServerProcess(url, uploadsDir, {}, { bare: true })
    try {
      const count = await db('users').count({ count: '*' })
      expect(Number(count[0]?.count)).toBe(0)
      const demo = await new ApiSession(server.url).signIn('admin@demo.test', 'demo-password')
      expect(demo.status).toBe(401)
    } finally {
      server.child.kill('SIGTERM')
      await server.exited
    }
  }, 60_000)

  it('gets its first administrator from `npm run create-admin`, with a one-time password', async () => {
    const { stdout } = await run(
      process.execPath,
      [
        '--import',
        'tsx',
        'scripts/create-admin.ts',
        '--email',
        'First@Lab.example',
        '--name',
        'Ada First',
      ],
      {
        cwd: repoRoot,
        env: { PATH: process.env.PATH, DATABASE_URL: testDatabaseUrl(), PASSWORD_COST: '10' },
      },
    )
    const oneTimePassword = /One-time password \(valid 72 hours\): (\S+)/.exec(stdout)?.[1]
    expect(oneTimePassword).toBeDefined()
    const app = createApp({ db, config: testConfig(), clientDir: '/nonexistent' })
    const session = new ApiSession(app)
    const login = await session.signIn('first@lab.example', oneTimePassword!)
    expect(login.status).toBe(200)
    expect(login.body.data.user).toMatchObject({ roles: ['admin'], mustChangePassword: true })
    expect((await session.get('/api/people')).body.error.code).toBe('password_change_required')
    const again = run(
      process.execPath,
      ['--import', 'tsx', 'scripts/create-admin.ts', '--email', 'first@lab.example', '--name', 'X'],
      { cwd: repoRoot, env: { PATH: process.env.PATH, DATABASE_URL: testDatabaseUrl() } },
    )
    await expect(again).rejects.toThrow(/already exists/)
  }, 60_000)
})

describe('answers in production', () => {
  const production = createApp({
    db,
    config: testConfig({ nodeEnv: 'production' }),
    clientDir: '/nonexistent',
  })

  it('carry HSTS, a CSP without a base, no-store, and the __Host- Secure cookie', async () => {
    const response = await request(production)
      .get('/api/auth/csrf')
      .set('X-Forwarded-Proto', 'https')
      .expect(200)
    expect(response.headers['strict-transport-security']).toMatch(/max-age=\d+/)
    expect(response.headers['content-security-policy']).toContain("base-uri 'none'")
    expect(response.headers['cache-control']).toBe('no-store')
    const cookie = ([] as string[]).concat(response.headers['set-cookie'] ?? [])[0]
    expect(cookie).toMatch(/^__Host-fractolog\.sid=.*;\s*Secure/i)
  })
})

describe('every API answer', () => {
  it('says no-store: one-time passwords and case data must not stay in caches', async () => {
    const app = createApp({ db, config: testConfig(), clientDir: '/nonexistent' })
    const admin = await makePerson(db, ['admin'])
    const session = await signedIn(app, admin.email, admin.password)
    for (const path of ['/api/cases', '/api/people', '/api/auth/me', '/api/nothing-here']) {
      expect((await session.get(path)).headers['cache-control'], path).toBe('no-store')
    }
    const created = await session.post('/api/people', {
      email: 'otp@example.test',
      name: 'Otp',
      roles: ['lab'],
    })
    expect(created.headers['cache-control']).toBe('no-store')
  })
})
