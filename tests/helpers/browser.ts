import { mkdirSync, mkdtempSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join, resolve } from 'node:path'
import { chromium, type APIRequestContext, type BrowserContext, type Page } from 'playwright-core'
import type { Knex } from 'knex'
import { afterAll, beforeAll, expect, inject } from 'vitest'
import { createDb } from '../../server/db/knex'
import { PEOPLE } from '../../seeds/demo-scenario'
import { currentCodeFor } from './second-factor-keys'

export const SCREENSHOT_DIR = resolve(import.meta.dirname, '../e2e/screenshots')

export interface BrowserSession {
  context: BrowserContext
  page: Page
  /** console errors and uncaught page errors seen so far */
  errors: string[]
  close: () => Promise<void>
}

/** Debian's Chromium through playwright-core, with a throw-away profile and no outside traffic. */
export async function openBrowser(): Promise<BrowserSession> {
  const profile = mkdtempSync(join(tmpdir(), 'fractolog-chromium-'))
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    headless: true,
    viewport: { width: 1280, height: 800 },
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  })
  const page = context.pages()[0] ?? (await context.newPage())
  const errors: string[] = []
  page.on('console', (message) => {
    if (message.type() !== 'error') return
    // The browser's note on a failed load names the resource only in its location.
    const { url } = message.location()
    errors.push(url ? `${message.text()} at ${url}` : message.text())
  })
  page.on('pageerror', (error) => errors.push(error.message))
  return {
    context,
    page,
    errors,
    close: async () => {
      await context.close()
      rmSync(profile, { recursive: true, force: true })
    },
  }
}

export async function screenshot(page: Page, name: string): Promise<string> {
  mkdirSync(SCREENSHOT_DIR, { recursive: true })
  const path = join(SCREENSHOT_DIR, `${name}.png`)
  // finish enter transitions (messages, dialogs) so the picture shows what the person ends up seeing
  await page.screenshot({ path, fullPage: true, animations: 'disabled' })
  return path
}

export interface ExpectedFailure {
  status: number
  /** API path after /api, e.g. /auth/me */
  path: string
}

function escapeRegExp(text: string): string {
  return text.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')
}

/**
 * Console errors left after removing the browser's own notes on API answers the journey expects
 * to fail (a refused sign-in, a 404 for a case one may not see).
 */
export function unexpectedErrors(errors: string[], expected: ExpectedFailure[]): string[] {
  const patterns = expected.map(
    ({ status, path }) =>
      new RegExp(
        `^Failed to load resource: the server responded with a status of ${status} \\(.*\\) ` +
          `at https?://[^/]+/api${escapeRegExp(path)}$`,
      ),
  )
  return errors.filter((error) => !patterns.some((pattern) => pattern.test(error)))
}

let e2eDb: Knex | undefined

/**
 * The person's current second-factor code: the demo accounts share the key DEMO_TOTP_SECRET,
 * anyone else's is read from the browser tests' database.
 */
export async function secondFactorCodeFor(email: string): Promise<string> {
  const url = process.env.E2E_DATABASE_URL
  if (!url) throw new Error('E2E_DATABASE_URL is not set: run the tests through `npm test`')
  e2eDb ??= createDb(url, { min: 0, max: 1, idleTimeoutMillis: 1_000 })
  const demo = PEOPLE.some((person) => person.email === email.toLowerCase())
  return currentCodeFor(email, { db: e2eDb, secret: demo ? inject('demoTotpSecret') : undefined })
}

/**
 * Signs a playwright API context in fully (password, then the second factor's code when asked),
 * for journeys that prepare data through the API; answers the last step's status.
 */
export async function apiSignIn(
  api: APIRequestContext,
  email: string,
  password: string,
): Promise<number> {
  const token = async () => (await (await api.get('/api/auth/csrf')).json()).data.token as string
  const login = await api.post('/api/auth/login', {
    headers: { 'X-CSRF-Token': await token() },
    data: { email, password },
  })
  if (login.status() !== 200 || !(await login.json()).data.secondFactorRequired) {
    return login.status()
  }
  const completed = await api.post('/api/auth/second-factor', {
    headers: { 'X-CSRF-Token': await token() },
    data: { code: await secondFactorCodeFor(email) },
  })
  return completed.status()
}

/**
 * Signs in through the sign-in page, with the second factor's code when the page asks for it,
 * and waits until the app has left the page.
 */
export async function signIn(page: Page, baseUrl: string, email: string, password: string) {
  await page.goto(`${baseUrl}/sign-in`)
  await page.locator('#email').fill(email)
  await page.locator('#password').fill(password)
  await page.getByTestId('sign-in-submit').click()
  const codeField = page.locator('#second-factor-code')
  const leftSignIn = () => new URL(page.url()).pathname !== '/sign-in'
  await expect.poll(async () => leftSignIn() || (await codeField.isVisible())).toBe(true)
  if (!leftSignIn()) {
    await codeField.fill(await secondFactorCodeFor(email))
    await page.getByTestId('second-factor-submit').click()
  }
  await page.waitForURL((url) => url.pathname !== '/sign-in')
}

/** Waits until no table on the page is loading (PrimeVue's overlay, or `aria-busy` on a list). */
export async function waitForTable(page: Page): Promise<void> {
  await expect
    .poll(() => page.locator('.p-datatable-mask, table[aria-busy="true"]').count())
    .toBe(0)
}

/** One browser for the test file: opened before its tests, closed after; call it for the session. */
export function useBrowser(): () => BrowserSession {
  let session: BrowserSession | undefined
  beforeAll(async () => {
    session = await openBrowser()
  })
  afterAll(() => session?.close())
  return () => {
    if (!session) throw new Error('the browser opens in beforeAll')
    return session
  }
}
