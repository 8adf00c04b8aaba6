import { describe, expect, inject, it } from 'vitest'
import { screenshot, signIn, waitForTable, useBrowser } from '../helpers/browser'

const browser = useBrowser()

describe('an investigator opening a case', () => {
  it('fills the new-case form, lands on the case, moves it on and finds it in the list', async () => {
    const page = browser().page
    const base = inject('baseUrl')
    const title = `Snapped lifting lug ${Date.now()}`
    await signIn(page, base, 'investigator@demo.test', inject('demoPassword'))
    await page.waitForURL(`${base}/`)
    await page.getByTestId('nav-cases').click()
    await page.waitForURL(`${base}/cases`)
    await expect
      .poll(() => page.getByTestId('case-table').locator('tbody tr').count())
      .toBeGreaterThan(1)

    await page.getByTestId('new-case').click()
    await page.waitForURL(`${base}/cases/new`)
    await page.getByTestId('create-case').click()
    await expect
      .poll(() => page.getByTestId('title-error').textContent())
      .toBe('Title is required.')
    await expect
      .poll(() => page.getByTestId('organisation-error').textContent())
      .toBe('Choose the client organisation.')

    await page.locator('#title').fill(title)
    await page.getByTestId('organisation-select').click()
    await page.getByRole('option', { name: 'Tallowmere Cranes Ltd' }).click()
    await page.locator('#component').fill('Lifting lug, spreader beam')
    await page.locator('#part-number').fill('LL-220-B')
    await page.locator('#material').fill('S355J2, as-welded')
    await page.getByTestId('turnaround').getByText('Expedited').click()
    await page.locator('#received-on').fill('2026-02-20')
    await page.locator('#failure-date').fill('2026-02-14')
    await page.locator('#due-date').fill('2026-04-30')
    expect(await page.getByTestId('title-error').count()).toBe(0)
    await screenshot(page, 'new-case-form')
    await page.getByTestId('create-case').click()

    await page.waitForURL(/\/cases\/\d+$/)
    await expect.poll(() => page.getByTestId('case-title').textContent()).toBe(title)
    expect(await page.getByTestId('case-number').textContent()).toMatch(/^FL-\d{4}-\d{4}$/)
    expect(await page.getByTestId('case-lead').textContent()).toBe('Tomas Reyke')
    expect(await page.getByTestId('case-status').textContent()).toBe('Intake')

    await page.getByTestId('move-to-examination').click()
    await page.getByTestId('confirm-move').click()
    await expect.poll(() => page.getByTestId('case-status').textContent()).toBe('Examination')
    await expect.poll(() => page.getByRole('alertdialog').count()).toBe(0)
    expect(await page.getByTestId('move-to-drafting').isVisible()).toBe(true)
    await screenshot(page, 'case-page')

    await page.getByTestId('nav-cases').click()
    await page.getByTestId('case-search').fill(title)
    const rows = page.getByTestId('case-table').locator('tbody tr')
    await expect.poll(() => rows.count()).toBe(1)
    await expect.poll(() => rows.first().textContent()).toContain(title)
    await waitForTable(page)
    await screenshot(page, 'case-list-search')
    await rows.first().getByText(title).click()
    await page.waitForURL(/\/cases\/\d+$/)

    expect(browser().errors).toEqual([])
  })
})
