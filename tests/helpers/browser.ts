import { mkdirSync, mkdtempSync, rmSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join, resolve } from 'node:path'
import { chromium, type BrowserContext, type Page } from 'playwright-core'

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
    if (message.type() === 'error') errors.push(message.text())
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
  await page.screenshot({ path, fullPage: true })
  return path
}
