import { mkdtempSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { describe, expect, inject, it } from 'vitest'
import { tinyPdf } from '../factories/files'
import { screenshot, signIn, unexpectedErrors, useBrowser } from '../helpers/browser'

const browser = useBrowser()

describe('the service history', () => {
  it('lets the lead add dated events with a document and shows the timeline and service life', async () => {
    const page = browser().page
    const base = inject('baseUrl')
    const title = 'Leak at heat-exchanger nozzle weld'
    const drawing = join(mkdtempSync(join(tmpdir(), 'fractolog-doc-')), 'nozzle drawing.pdf')
    writeFileSync(drawing, tinyPdf())

    await signIn(page, base, 'investigator@demo.test', inject('demoPassword'))
    await page.goto(`${base}/cases?q=${encodeURIComponent('nozzle weld')}`)
    await page.getByTestId('case-table').getByText(title).click()
    await page.waitForURL(/\/cases\/\d+$/)
    await page.getByTestId('section-case-service-history').click()
    await expect
      .poll(() => page.getByTestId('service-history').textContent())
      .toContain('Nothing recorded yet.')

    await page.getByTestId('add-event').click()
    await page.getByTestId('event-kind').click()
    await page.getByRole('option', { name: 'Installation', exact: true }).click()
    await page.locator('#event-date').fill('2016-03-01')
    await page.locator('#event-description').fill('Exchanger E-4 installed and hydrotested.')
    await page.locator('#event-hours').fill('0')
    await page.getByTestId('save-event').click()
    await expect.poll(() => page.getByTestId('service-event').count()).toBe(1)

    await page.getByTestId('add-event').click()
    await page.getByTestId('event-kind').click()
    await page.getByRole('option', { name: 'Failure', exact: true }).click()
    await page.locator('#event-date').fill('2999-01-01')
    await page.locator('#event-description').fill('Weep found at nozzle N2 toe during a walk-down.')
    await page.getByTestId('save-event').click()
    await expect
      .poll(() => page.getByTestId('event-date-error').textContent())
      .toContain('between 1800 and 2200')
    await page.locator('#event-date').fill('2026-03-01')
    await page.locator('#event-hours').fill('87600')
    await page.getByTestId('save-event').click()
    await expect.poll(() => page.getByTestId('service-event').count()).toBe(2)

    await page.getByTestId('attach-input').first().setInputFiles(drawing)
    await expect.poll(() => page.getByTestId('attachment-link').count()).toBe(1)
    expect(await page.getByTestId('attachment-link').textContent()).toContain('nozzle drawing.pdf')
    // 2016-03-01 to 2026-03-01: 3653 days / 365.25 = 10.0 years (Julian year)
    expect(await page.getByTestId('life-years').textContent()).toBe('10 years')
    expect(await page.getByTestId('life-hours').textContent()).toBe('87,600 h')
    await screenshot(page, 'service-history')
    expect(unexpectedErrors(browser().errors, [{ status: 401, path: '/auth/me' }])).toEqual([])
  })
})
