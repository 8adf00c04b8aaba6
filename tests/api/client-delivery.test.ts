import { readFileSync } from 'node:fs'
import { get, type IncomingHttpHeaders, type Server } from 'node:http'
import type { AddressInfo } from 'node:net'
import { join } from 'node:path'
import { brotliDecompressSync, gunzipSync } from 'node:zlib'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createApp } from '../../server/app'
import { makeOrganisation, makePerson } from '../factories'
import { signedIn } from '../helpers/api-session'
import { CLIENT_DIR, entryFiles, readManifest } from '../helpers/client-bundle'
import { testConfig } from '../helpers/test-config'
import { createTestDb } from '../helpers/test-db'

// Reads the client built by `npm test` (or `npm run build`) before the API tests run.
const db = createTestDb()
const app = createApp({ db, config: testConfig(), clientDir: CLIENT_DIR })
const entryScript = `/${entryFiles(readManifest())[0]}`
const entryBytes = readFileSync(join(CLIENT_DIR, entryScript))
let server: Server
let base = ''

beforeAll(async () => {
  server = await new Promise<Server>((done) => {
    const listening = app.listen(0, '127.0.0.1', () => done(listening))
  })
  base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`
})

afterAll(async () => {
  await new Promise((done) => server.close(done))
  await db.destroy()
})

interface RawAnswer {
  status: number
  headers: IncomingHttpHeaders
  body: Buffer
}

/** A GET that keeps the bytes as sent: no client in between decompresses them. */
function rawGet(path: string, headers: Record<string, string> = {}): Promise<RawAnswer> {
  return new Promise((resolveAnswer, reject) => {
    get(`${base}${path}`, { headers }, (response) => {
      const chunks: Buffer[] = []
      response.on('data', (chunk: Buffer) => chunks.push(chunk))
      response.on('end', () =>
        resolveAnswer({
          status: response.statusCode ?? 0,
          headers: response.headers,
          body: Buffer.concat(chunks),
        }),
      )
    }).on('error', reject)
  })
}

const YEAR_IMMUTABLE = 'public, max-age=31536000, immutable'

describe('the built client as sent', () => {
  it('sends the brotli copy made at build time when the browser accepts it, kept for a year', async () => {
    const answer = await rawGet(entryScript, { 'accept-encoding': 'gzip, deflate, br' })
    expect(answer.status).toBe(200)
    expect(answer.headers['content-encoding']).toBe('br')
    expect(answer.headers.vary).toMatch(/Accept-Encoding/i)
    expect(answer.headers['content-type']).toMatch(/^(text|application)\/javascript/)
    expect(answer.headers['cache-control']).toBe(YEAR_IMMUTABLE)
    expect(answer.body.length).toBeLessThan(entryBytes.length / 2)
    expect(brotliDecompressSync(answer.body).equals(entryBytes)).toBe(true)
  })

  it('sends gzip to a browser without brotli, and the plain file to one that asks for neither', async () => {
    const gzip = await rawGet(entryScript, { 'accept-encoding': 'gzip' })
    expect(gzip.headers['content-encoding']).toBe('gzip')
    expect(gzip.headers['cache-control']).toBe(YEAR_IMMUTABLE)
    expect(gunzipSync(gzip.body).equals(entryBytes)).toBe(true)

    const plain = await rawGet(entryScript)
    expect(plain.headers['content-encoding']).toBeUndefined()
    expect(plain.headers['cache-control']).toBe(YEAR_IMMUTABLE)
    expect(plain.body.equals(entryBytes)).toBe(true)
  })

  it('answers app addresses with index.html, compressed and checked again on every visit', async () => {
    const page = await rawGet('/cases?status=intake', { 'accept-encoding': 'br' })
    expect(page.status).toBe(200)
    expect(page.headers['content-encoding']).toBe('br')
    expect(page.headers['content-type']).toMatch(/^text\/html/)
    expect(page.headers['cache-control']).toBe('no-cache')
    expect(brotliDecompressSync(page.body).toString()).toContain(entryScript)

    const etag = page.headers.etag ?? ''
    expect(etag).not.toBe('')
    const again = await rawGet('/cases', { 'accept-encoding': 'br', 'if-none-match': etag })
    expect(again.status).toBe(304)
    expect(again.body.length).toBe(0)
  })

  it('answers 404 for a hashed file of an older build, not the page', async () => {
    const answer = await rawGet('/assets/index-0ldBuild.js', { 'accept-encoding': 'br' })
    expect(answer.status).toBe(404)
    expect(answer.headers['content-type']).toMatch(/^text\/plain/)
  })

  it('compresses larger API answers for a browser that accepts it', async () => {
    for (let count = 0; count < 40; count++) await makeOrganisation(db)
    const admin = await makePerson(db, ['admin'])
    const session = await signedIn(app, admin.email, admin.password)
    const answer = await session.get('/api/organisations').set('Accept-Encoding', 'gzip')
    expect(answer.status).toBe(200)
    expect(answer.headers['content-encoding']).toBe('gzip')
    expect(answer.body.data.length).toBeGreaterThanOrEqual(40)
  })
})
