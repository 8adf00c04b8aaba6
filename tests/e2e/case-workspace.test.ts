import type { Page } from 'playwright-core'
import { describe, expect, inject, it } from 'vitest'
import {
  openBrowser,
  screenshot,
  signIn,
  unexpectedErrors,
  useBrowser,
  type BrowserSession,
} from '../helpers/browser'

const browser = useBrowser()

async function openDemoCase(page: Page, base: string, title: string): Promise<string> {
  await page.goto(`${base}/cases`)
  await page.getByTestId('case-search').fill(title)
  const rows = page.getByTestId('case-table').locator('tbody tr')
  await expect.poll(() => rows.count()).toBe(1)
  await rows.first().getByText(title).click()
  await page.waitForURL(/\/cases\/\d+$/)
  await expect.poll(() => page.getByTestId('case-title').textContent()).toBe(title)
  return page.url()
}

async function choose(page: Page, testid: string, option: string): Promise<void> {
  await page.getByTestId(testid).click()
  await page.locator('.p-select-overlay').getByRole('option', { name: option, exact: true }).click()
}

/** Ticks one option of a multiple choice, then closes its list by clicking outside it. */
async function tick(page: Page, testid: string, option: string): Promise<void> {
  await page.getByTestId(testid).click()
  const overlay = page.locator('.p-multiselect-overlay')
  await overlay.getByRole('option', { name: option, exact: true }).click()
  await page.getByTestId('case-title').click()
  await overlay.waitFor({ state: 'detached' })
}

describe('the case workspace', () => {
  it('lets the lead edit, assign, classify and move a case, with a stale copy elsewhere refused and retried', async () => {
    const page = browser().page
    const base = inject('baseUrl')
    const password = inject('demoPassword')
    const title = 'Bent outrigger beam after set-down'
    await signIn(page, base, 'investigator@demo.test', password)
    const caseUrl = await openDemoCase(page, base, title)

    // a second browser (the administrator) opens the editor on the same version
    let other: BrowserSession | undefined
    try {
      other = await openBrowser()
      await signIn(other.page, base, 'admin@demo.test', password)
      await other.page.goto(caseUrl)
      await other.page.getByTestId('edit-case').click()
      await other.page.locator('#title').fill('Outrigger beam buckled on set-down')

      await page.getByTestId('edit-case').click()
      await page.locator('#clientReference').fill('TC-NCR-2310')
      await page.locator('#heatOrLot').fill('H 77120')
      await page.getByTestId('safety-critical-switch').click()
      await tick(page, 'co-investigators-select', 'Maren Costa')
      await choose(page, 'reviewer-select', 'Anwen Tarrock')
      await tick(page, 'mechanisms-select', 'Ductile overload')
      await choose(page, 'primary-mechanism-select', 'Ductile overload')
      await choose(page, 'root-cause-select', 'Service or operation')
      await screenshot(page, 'case-record-form')
      await page.getByTestId('save-case').click()

      await expect.poll(() => page.getByTestId('case-overview').isVisible()).toBe(true)
      expect(await page.getByTestId('case-client-reference').textContent()).toBe('TC-NCR-2310')
      expect(await page.getByTestId('case-co-investigators').textContent()).toBe('Maren Costa')
      expect(await page.getByTestId('case-reviewer').textContent()).toBe('Anwen Tarrock')
      expect(await page.getByTestId('case-mechanisms').textContent()).toBe(
        'Ductile overload (primary)',
      )
      expect(await page.getByTestId('safety-critical').first().isVisible()).toBe(true)

      await page.getByTestId('move-to-examination').click()
      await page.getByTestId('confirm-move').click()
      await expect.poll(() => page.getByTestId('case-status').textContent()).toBe('Examination')
      await screenshot(page, 'case-overview-edited')

      await page.getByTestId('section-case-activity').click()
      const rows = page.getByTestId('activity-row')
      await expect.poll(() => rows.count()).toBe(3)
      expect(await rows.nth(0).textContent()).toContain('Intake → Examination')
      expect(await rows.nth(1).textContent()).toContain('Client reference: — → TC-NCR-2310')
      await choose(page, 'activity-kind', 'Status changed')
      await expect.poll(() => rows.count()).toBe(1)
      await screenshot(page, 'case-activity')

      // the administrator's copy is now stale: refused, edits kept, then saved on purpose
      await other.page.getByTestId('save-case').click()
      await expect
        .poll(() => other!.page.getByTestId('version-conflict').textContent())
        .toContain('Someone else saved this case')
      expect(await other.page.getByTestId('changed-meanwhile').textContent()).toContain(
        'Client reference',
      )
      expect(await other.page.locator('#title').inputValue()).toBe(
        'Outrigger beam buckled on set-down',
      )
      await screenshot(other.page, 'case-version-conflict')
      await other.page.getByTestId('keep-mine').click()
      await other.page.getByTestId('save-case').click()
      await expect
        .poll(() => other!.page.getByTestId('case-title').textContent())
        .toBe('Outrigger beam buckled on set-down')
      expect(await other.page.getByTestId('case-client-reference').textContent()).toBe(
        'TC-NCR-2310',
      )
      expect(
        unexpectedErrors(other.errors, [
          { status: 401, path: '/auth/me' },
          { status: 409, path: new URL(caseUrl).pathname },
        ]),
      ).toEqual([])
    } finally {
      await other?.close()
    }
    // every section now has its page: the review section opens on this case, still in intake
    await page.getByTestId('section-case-review').click()
    await page.getByTestId('case-review').waitFor()
    expect(unexpectedErrors(browser().errors, [{ status: 401, path: '/auth/me' }])).toEqual([])
  })
})
