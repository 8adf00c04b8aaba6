import { resolve } from 'node:path'
import { describe, expect, inject, it } from 'vitest'
import { screenshot, signIn, unexpectedErrors, useBrowser } from '../helpers/browser'

const browser = useBrowser()
// Open 42CrMoS4 record (CC BY 4.0, see tests/fixtures/tensile-42CrMoS4/README.md).
const RECORD = resolve(import.meta.dirname, '../fixtures/tensile-42CrMoS4/46NT73.csv')
const TITLE = 'Fractured hook block pin, gantry crane 3'

async function openSection(page: ReturnType<typeof browser>['page'], base: string) {
  await page.goto(`${base}/cases?q=${encodeURIComponent('hook block pin')}`)
  await page.getByTestId('case-table').getByText(TITLE).click()
  await page.waitForURL(/\/cases\/\d+$/)
  await page.getByTestId('section-case-mechanical-tests').click()
  await page.getByTestId('mechanical-tests').waitFor()
}

describe('mechanical tests', () => {
  it('takes the lab technician from a raw export to a confirmed, checked result', async () => {
    const page = browser().page
    const base = inject('baseUrl')
    await signIn(page, base, 'lab@demo.test', inject('demoPassword'))
    await openSection(page, base)

    await page.getByTestId('specimen-label').fill('E2E-T1')
    await page.getByTestId('add-specimen').click()
    await page.getByTestId('specimen-E2E-T1').waitFor()
    await page.getByTestId('specimen-E2E-T1').getByTestId('upload-record').click()
    await page.getByTestId('record-file').setInputFiles(RECORD)
    await expect.poll(() => page.getByTestId('record-dialect').textContent()).toContain('tab')

    // A wrong mapping is refused in the engine's words; the right one draws the curve.
    await page.getByTestId('map-forceColumn').click()
    await page.getByRole('option', { name: 'Time', exact: true }).click()
    await expect
      .poll(() => page.getByTestId('record-problem').textContent())
      .toContain('not recognised as a force unit')
    await page.getByTestId('map-forceColumn').click()
    await page.getByRole('option', { name: 'Force', exact: true }).click()
    await page.getByTestId('record-uncertainty').fill('10MPa,0.5%')
    await page.getByTestId('fit-range').fill('100:400MPa')
    await expect.poll(() => page.getByTestId('used-columns').textContent()).toContain('“Force”')
    await page.getByTestId('stress-strain-chart').waitFor()
    // the demo's own records are on the page too: read the preview's table
    const preview = page.getByTestId('record-preview').getByTestId('tensile-properties')
    await expect.poll(() => preview.textContent()).toContain('Rm')
    await screenshot(page, 'mechanical-tests-preview')
    await page.getByTestId('save-record').click()

    const specimen = page.getByTestId('specimen-E2E-T1')
    await specimen.getByTestId('tensile-properties').waitFor()
    await specimen.getByTestId('recompute-fit-range').fill('150:450MPa')
    await specimen.getByTestId('recompute').click()
    await expect
      .poll(() => specimen.getByTestId('tensile-properties').first().textContent())
      .toContain('Elastic slope')
    await specimen.getByTestId('show-curve').click()
    await specimen.getByTestId('stress-strain-chart').waitFor()
    await specimen.getByTestId('confirm-record').click()
    await expect.poll(() => specimen.textContent()).toContain('Confirmed')
    await screenshot(page, 'mechanical-tests-confirmed')

    // hardness across the section, converted with the named table (ASTM E140, from memory)
    await page.getByTestId('hardness-readings').fill('39.5 40 40.5')
    await page.getByTestId('add-hardness').click()
    const table = page.getByTestId('hardness-table')
    await expect.poll(() => table.textContent()).toContain('40 HRC')
    expect(await table.textContent()).toContain('392 HV')
    expect(await table.textContent()).toContain('ASTM E140')
    expect(unexpectedErrors(browser().errors, [{ status: 401, path: '/auth/me' }])).toEqual([])
  })

  it('lets the investigator link the material and shows the verdict with its rule and caution', async () => {
    const page = browser().page
    const base = inject('baseUrl')
    await page.context().clearCookies()
    await signIn(page, base, 'investigator@demo.test', inject('demoPassword'))
    await openSection(page, base)
    // the demo links the pin to A193-B7; the investigator links the open record's steel instead
    await page.getByTestId('section-case').click()
    await page.getByTestId('edit-case').click()
    await page.getByTestId('specification-select').click()
    await page
      .locator('.p-select-overlay')
      .getByRole('option', { name: '42CrMo4+QT — EN 10083-3', exact: true })
      .click()
    await page.locator('#section-size').fill('14')
    await page.locator('#section-size').blur()
    await expect.poll(() => page.getByTestId('band-select').textContent()).toContain('up to 16 mm')
    expect(await page.getByTestId('link-unverified').textContent()).toContain('Unverified')
    await page.getByTestId('material-link').scrollIntoViewIfNeeded()
    await screenshot(page, 'mechanical-tests-link-material')
    await page.getByTestId('save-case').click()
    await expect
      .poll(() => page.getByTestId('case-linked-specification').textContent())
      .toBe('42CrMo4+QT (EN 10083-3), up to 16 mm — unverified starter limits')

    await page.getByTestId('section-case-mechanical-tests').click()
    const conformity = page.getByTestId('specimen-E2E-T1').getByTestId('tensile-conformity')
    await expect
      .poll(() => conformity.textContent())
      .toContain('against 42CrMo4+QT (EN 10083-3), size band up to 16 mm')
    expect(await conformity.textContent()).toContain('Decision rule')
    expect(await conformity.getByTestId('unverified-mark').textContent()).toContain('Unverified')
    expect(await conformity.getByTestId('verdict-caution').textContent()).toContain(
      'Indicative only',
    )
    const verdict = (await page.getByTestId('case-verdict').textContent())?.replace(/\s+/g, ' ')
    expect(verdict).toContain('overall against 42CrMo4+QT (EN 10083-3), size band up to 16 mm')
    expect(verdict).toContain('Indicative only')
    expect(await page.getByTestId('confirm-record').count()).toBe(0)
    await screenshot(page, 'mechanical-tests-investigator')

    // every specimen's curve in one chart, then as true stress–strain up to maximum force
    await page.getByTestId('compare-curves').click()
    const overlay = page.getByTestId('specimen-overlay')
    await overlay.locator('canvas').waitFor()
    await overlay.getByTestId('overlay-view').getByText('True (to maximum force)').click()
    await overlay.locator('canvas').scrollIntoViewIfNeeded()
    await screenshot(page, 'mechanical-tests-overlay-true')
  })

  it('shows the client only confirmed results of their own case, with the verdict, rule and caution', async () => {
    const page = browser().page
    const base = inject('baseUrl')
    await page.context().clearCookies()
    await signIn(page, base, 'client@demo.test', inject('demoPassword'))
    await page.goto(`${base}/cases?q=${encodeURIComponent('hook block pin')}`)
    await page.getByTestId('case-table').getByText(TITLE).click()
    const results = page.getByTestId('client-test-results')
    await results.waitFor()
    const specimen = results.getByTestId('client-specimen-E2E-T1')
    const conformity = specimen.getByTestId('tensile-conformity')
    expect(await conformity.textContent()).toContain('Decision rule')
    expect(await conformity.getByTestId('verdict-caution').textContent()).toContain(
      'Indicative only',
    )
    expect(await results.getByTestId('case-verdict').textContent()).toContain('42CrMo4+QT')
    for (const control of ['upload-record', 'show-curve', 'confirm-record', 'hardness-table'])
      expect(await page.getByTestId(control).count(), control).toBe(0)
    await specimen.scrollIntoViewIfNeeded()
    await screenshot(page, 'mechanical-tests-client')
    expect(unexpectedErrors(browser().errors, [{ status: 401, path: '/auth/me' }])).toEqual([])
  })
})
