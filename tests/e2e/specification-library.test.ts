import { describe, expect, inject, it } from 'vitest'
import { screenshot, signIn, useBrowser } from '../helpers/browser'

const browser = useBrowser()

describe('the specification library', () => {
  it('lets an administrator add a size band to a record and record a check against the edition', async () => {
    const page = browser().page
    const base = inject('baseUrl')
    await signIn(page, base, 'admin@demo.test', inject('demoPassword'))
    await page.getByTestId('nav-specifications').click()
    await page.waitForURL(`${base}/specifications`)
    await page.getByTestId('specification-table').waitFor()
    await screenshot(page, 'specification-library')
    await page.getByTestId('spec-link-S235JR').click()
    await expect.poll(() => page.getByTestId('spec-title').textContent()).toBe('S235JR')
    expect(await page.getByTestId('spec-unverified').textContent()).toContain('Unverified')

    // EN 10025-2, S235JR over 16 up to 40 mm: ReH ≥ 225 MPa (limits recalled from memory)
    await page.getByTestId('edit-spec').click()
    await page.getByTestId('add-band').click()
    await page.getByTestId('band-1-over').locator('input').fill('16')
    await page.getByTestId('band-1-up-to').locator('input').fill('40')
    await page.getByTestId('band-1-yield').locator('input').fill('225')
    await page.getByTestId('band-1-rm-min').locator('input').fill('360')
    await page.getByTestId('band-1-rm-max').locator('input').fill('510')
    await page.getByTestId('band-1-elongation-0').locator('input').fill('26')
    await page.getByTestId('band-1-elongation-0').locator('input').blur()
    await screenshot(page, 'specification-edit')
    await page.getByTestId('save-spec').click()
    const bands = page.getByTestId('band-table')
    await expect.poll(() => bands.textContent()).toContain('over 16 up to 40 mm')
    expect(await bands.textContent()).toContain('225 MPa (Rp0.2)')

    await page.getByTestId('checked-edition').fill('2019')
    await page.getByTestId('record-check').click()
    await expect.poll(() => page.getByTestId('spec-checked').textContent()).toContain('2019')
    expect(await page.getByTestId('spec-unverified').count()).toBe(0)
    await screenshot(page, 'specification-checked')
    expect(browser().errors).toEqual([])
  })

  it('shows staff the library to read, without the means to change it', async () => {
    const page = browser().page
    const base = inject('baseUrl')
    await page.context().clearCookies()
    await signIn(page, base, 'lab@demo.test', inject('demoPassword'))
    await page.getByTestId('nav-specifications').click()
    await page.getByTestId('spec-link-A193-B7').click()
    await page.getByTestId('band-table').waitFor()
    expect(await page.getByTestId('edit-spec').count()).toBe(0)
    expect(await page.getByTestId('record-check').count()).toBe(0)
    expect(await page.getByTestId('new-spec').count()).toBe(0)
  })
})
