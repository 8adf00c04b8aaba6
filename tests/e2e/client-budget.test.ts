import { join } from 'node:path'
import { statSync } from 'node:fs'
import type { Server } from 'node:http'
import type { AddressInfo } from 'node:net'
import express from 'express'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import { createApp } from '../../server/app'
import { createDb } from '../../server/db/knex'
import { secondFactorCodeFor, useBrowser, waitForTable } from '../helpers/browser'
import {
  CLIENT_DIR,
  FIRST_VISIT_BUDGET,
  journeyFiles,
  readManifest,
  totalGzipSize,
  viewAt,
} from '../helpers/client-bundle'
import { testConfig } from '../helpers/test-config'
import { testDatabaseUrl } from '../helpers/test-db'

/*
 * What a browser really fetches, seen from the server: this file serves the built client and the
 * API on its own port (on the seeded browser-test database) and notes every request it answers.
 */
interface Fetched {
  path: string
  status: number
  encoding: string | undefined
}

const browser = useBrowser()
const db = createDb(testDatabaseUrl('E2E_DATABASE_URL'), { min: 0, max: 4 })
const fetched: Fetched[] = []
let server: Server
let base = ''

beforeAll(async () => {
  const noted = express()
  noted.use((req, res, next) => {
    const path = req.originalUrl
    res.on('finish', () => {
      const encoding = res.getHeader('content-encoding')
      fetched.push({ path, status: res.statusCode, encoding: encoding?.toString() })
    })
    next()
  })
  noted.use(createApp({ db, config: testConfig(), clientDir: CLIENT_DIR }))
  server = await new Promise<Server>((done) => {
    const listening = noted.listen(0, '127.0.0.1', () => done(listening))
  })
  base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`
})

afterAll(async () => {
  await new Promise((done) => server.close(done))
  await db.destroy()
})

const scriptsOf = (requests: Fetched[]) =>
  requests.filter(({ path }) => /^\/assets\/.*\.js$/.test(path))

async function showCaseList(page: ReturnType<typeof browser>['page']): Promise<void> {
  await page.waitForURL(`${base}/cases`)
  await expect
    .poll(() => page.getByTestId('case-table').locator('tbody tr').count())
    .toBeGreaterThan(1)
  await waitForTable(page)
}

describe('the first screens over the network', () => {
  it(`fetch at most ${FIRST_VISIT_BUDGET / 1000} kB of JavaScript (gzip -9) for sign-in, then the case list`, async ({
    annotate,
  }) => {
    const page = browser().page
    // someone following a link to the case list: sign-in first, then the list
    await page.goto(`${base}/cases`)
    await page.waitForURL(/\/sign-in\?redirect=/)
    await page.getByTestId('sign-in-form').waitFor()
    await page.locator('#email').fill('investigator@demo.test')
    await page.locator('#password').fill(inject('demoPassword'))
    await page.getByTestId('sign-in-submit').click()
    await page
      .locator('#second-factor-code')
      .fill(await secondFactorCodeFor('investigator@demo.test'))
    await page.getByTestId('second-factor-submit').click()
    await showCaseList(page)

    const scripts = scriptsOf(fetched)
    const files = scripts.map(({ path }) => path.slice(1))
    // Each file once, exactly the ones the manifest predicts (which `npm run bench:client` reports).
    const manifest = readManifest()
    expect([...files].sort()).toEqual(
      journeyFiles(manifest, [viewAt('/sign-in'), viewAt('/cases')]),
    )
    // a file of a few hundred bytes may not shrink when compressed: it is sent as it is
    const worthCompressing = scripts.filter(
      ({ path }) => statSync(join(CLIENT_DIR, path)).size > 1024,
    )
    for (const script of worthCompressing) {
      expect(script.encoding, script.path).toMatch(/^(br|gzip)$/)
    }

    const total = totalGzipSize(files)
    await annotate(`first visit: ${files.length} scripts, ${(total / 1000).toFixed(1)} kB gzip -9`)
    expect(total).toBeLessThanOrEqual(FIRST_VISIT_BUDGET)
  })

  it('fetch nothing unchanged again on a later visit: the page is revalidated, the assets come from cache', async () => {
    fetched.length = 0
    const page = await browser().context.newPage()
    try {
      // the address the browser loaded last time: signed in now, it shows the case list at once
      await page.goto(`${base}/cases`)
      await showCaseList(page)
    } finally {
      await page.close()
    }
    expect(fetched.find(({ path }) => path === '/cases')?.status).toBe(304)
    expect(fetched.filter(({ path }) => path.startsWith('/assets/'))).toEqual([])
  })
})
