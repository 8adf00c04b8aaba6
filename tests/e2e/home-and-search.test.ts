import { describe, expect, inject, it } from 'vitest'
import { createDb } from '../../server/db/knex'
import { screenshot, signIn, unexpectedErrors, useBrowser, waitForTable } from '../helpers/browser'
import { testDatabaseUrl } from '../helpers/test-db'

const browser = useBrowser()
const SIGNED_OUT_CHECK = { status: 401, path: '/auth/me' }

describe('home pages and search', () => {
  it('shows an investigator their open cases and finds a case by a word inside its title', async () => {
    const page = browser().page
    const base = inject('baseUrl')
    await signIn(page, base, 'investigator@demo.test', inject('demoPassword'))
    await page.waitForURL(`${base}/`)
    const mine = page.getByTestId('home-myOpen')
    await expect.poll(() => mine.textContent()).toContain('Fractured hook block pin')
    expect(await mine.textContent()).not.toContain('Cracked compression fitting')
    await expect.poll(() => page.getByTestId('home-charts').locator('canvas').count()).toBe(2)
    await screenshot(page, 'home-investigator')

    await page.getByTestId('nav-cases').click()
    await page.getByTestId('case-search').fill('luffing')
    const rows = page.getByTestId('case-table').locator('tbody tr')
    await expect.poll(() => rows.count()).toBe(1)
    expect(await rows.first().textContent()).toContain('Cracked rope sheave on luffing hoist')
    await page.getByTestId('case-search').fill('')
    await page.getByTestId('safety-filter').click()
    await page.waitForURL(/safetyCritical=true/)
    await waitForTable(page)
    await expect.poll(async () => (await rows.allTextContents()).length).toBeGreaterThanOrEqual(2)
    for (const row of await rows.allTextContents()) expect(row).toContain('Safety-critical')
    expect(await page.getByTestId('case-table').textContent()).toContain('Sheared boom foot bolt')
    await screenshot(page, 'case-list-filtered')
    expect(unexpectedErrors(browser().errors, [SIGNED_OUT_CHECK])).toEqual([])
  })

  it('shows a reviewer what waits for their review', async () => {
    // the review step has its own actions in a later feature; here the case is put in review
    const db = createDb(testDatabaseUrl('E2E_DATABASE_URL'), { min: 0, max: 1 })
    try {
      await db('cases')
        .where({ title: 'Transfer pump shaft fracture' })
        .update({ status: 'in_review' })
    } finally {
      await db.destroy()
    }
    const page = browser().page
    const base = inject('baseUrl')
    await page.getByTestId('sign-out').click()
    await page.waitForURL(`${base}/sign-in`)
    await signIn(page, base, 'reviewer2@demo.test', inject('demoPassword'))
    await page.waitForURL(`${base}/`)
    await expect
      .poll(() => page.getByTestId('home-awaitingMyReview').textContent())
      .toContain('Transfer pump shaft fracture')
    expect(await page.getByTestId('home-myOpen').count()).toBe(0)
    await screenshot(page, 'home-reviewer')
  })
})
