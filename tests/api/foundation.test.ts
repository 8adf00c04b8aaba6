import express from 'express'
import request from 'supertest'
import { afterAll, describe, expect, it } from 'vitest'
import { createApp } from '../../server/app'
import { AppError } from '../../server/errors'
import { errorHandler } from '../../server/middleware/error-handler'
import { migrateLatest, migrationConfig, rollbackAll } from '../../server/db/migrations'
import { createTestDb } from '../helpers/test-db'
import { makePerson } from '../factories'
import { signedIn } from '../helpers/api-session'
import { testConfig } from '../helpers/test-config'

const db = createTestDb()
const app = createApp({ db, config: testConfig(), clientDir: '/nonexistent' })

afterAll(() => db.destroy())

describe('the private database', () => {
  it('is MariaDB listening on loopback', async () => {
    const [rows] = (await db.raw('SELECT VERSION() AS version, @@bind_address AS bind')) as [
      { version: string; bind: string }[],
    ]
    expect(rows[0]?.version).toMatch(/MariaDB/)
    if (!process.env.EXTERNAL_TEST_DATABASE) expect(rows[0]?.bind).toBe('127.0.0.1')
  })

  it('stores text as utf8mb4', async () => {
    const [rows] = (await db.raw(
      'SELECT DEFAULT_CHARACTER_SET_NAME AS charset FROM information_schema.SCHEMATA WHERE SCHEMA_NAME = DATABASE()',
    )) as [{ charset: string }[]]
    expect(rows[0]?.charset).toBe('utf8mb4')
  })

  it('migrates down to nothing and back up again', async () => {
    const undone = await rollbackAll(db)
    expect(undone.length).toBeGreaterThan(0)
    expect(await db.schema.hasTable('users')).toBe(false)
    const applied = await migrateLatest(db)
    expect(applied).toEqual([...undone].reverse())
    expect(await db.schema.hasTable('users')).toBe(true)
    const [, pending] = (await db.migrate.list(migrationConfig)) as [unknown[], unknown[]]
    expect(pending).toHaveLength(0)
    // every migration runs twice here: on a busy two-core machine that takes far beyond the
    // default bound, which is only meant to catch a hang
  }, 180_000)
})

describe('GET /api/health', () => {
  it('tells anyone only that the service is up; the database version to administrators', async () => {
    const response = await request(app).get('/api/health').expect(200)
    expect(response.body).toEqual({ data: { status: 'ok', database: { connected: true } } })
    const admin = await makePerson(db, ['admin'])
    const session = await signedIn(app, admin.email, admin.password)
    const full = await session.get('/api/health').expect(200)
    expect(full.body.data.database.version).toMatch(/MariaDB/)
  })

  it('sends security headers with a content security policy', async () => {
    const response = await request(app).get('/api/health')
    expect(response.headers['content-security-policy']).toContain("script-src 'self'")
    expect(response.headers['x-content-type-options']).toBe('nosniff')
    expect(response.headers['x-powered-by']).toBeUndefined()
  })
})

describe('API errors', () => {
  it('answers unknown API routes with a JSON 404', async () => {
    const response = await request(app).get('/api/no-such-thing').expect(404)
    expect(response.body.error.code).toBe('not_found')
    expect(response.body.error.message).toContain('/api/no-such-thing')
  })

  it('answers malformed JSON with 400, not a stack trace', async () => {
    const response = await request(app)
      .post('/api/health')
      .set('Content-Type', 'application/json')
      .send('{"broken":')
      .expect(400)
    expect(response.body.error.code).toBe('validation_failed')
    expect(response.body.error.message).toBe(
      'The request body is not valid JSON: send an application/json object.',
    )
    expect(JSON.stringify(response.body)).not.toMatch(/at .*\.ts:\d+/)
  })

  it('answers an oversized body with 413', async () => {
    const response = await request(app)
      .post('/api/health')
      .send({ text: 'x'.repeat(200_000) })
      .expect(413)
    expect(response.body.error.code).toBe('payload_too_large')
  })

  it('turns a service error into its status and an unknown error into a plain 500', async () => {
    const logged: unknown[] = []
    const probe = express()
    probe.get('/conflict', () => {
      throw new AppError('conflict', 'Already there.', { field: 'number' })
    })
    probe.get('/boom', () => {
      throw new Error('secret internals')
    })
    probe.use(errorHandler((error) => logged.push(error)))
    const conflict = await request(probe).get('/conflict').expect(409)
    expect(conflict.body).toEqual({
      error: { code: 'conflict', message: 'Already there.', details: { field: 'number' } },
    })
    const boom = await request(probe).get('/boom').expect(500)
    expect(boom.body).toEqual({
      error: { code: 'internal_error', message: 'Something went wrong.' },
    })
    expect(logged).toHaveLength(1)
  })
})
