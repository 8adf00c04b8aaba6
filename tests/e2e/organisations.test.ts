import { describe, expect, inject, it } from 'vitest'
import { screenshot, signIn, waitForTable, useBrowser } from '../helpers/browser'

const browser = useBrowser()

describe('an administrator keeping client organisations', () => {
  it('adds one, is told what is missing, and deactivates it', async () => {
    const page = browser().page
    const base = inject('baseUrl')
    const name = `Brackwater Pumps ${Date.now()}`
    await signIn(page, base, 'admin@demo.test', inject('demoPassword'))
    await page.getByTestId('nav-organisations').click()
    await page.waitForURL(`${base}/admin/organisations`)

    await page.getByTestId('add-organisation').click()
    await page.locator('#contact-email').fill('not an address')
    await page.getByTestId('save-organisation').click()
    await expect
      .poll(() => page.getByTestId('organisation-name-error').textContent())
      .toBe('Name is required.')
    await expect
      .poll(() => page.getByTestId('contact-email-error').textContent())
      .toBe('Enter a valid e-mail address.')
    await page.locator('#organisation-name').fill(name)
    await page.locator('#contact-name').fill('Oskar Lindqvist')
    await page.locator('#contact-email').fill('oskar@brackwater.test')
    await page.getByTestId('save-organisation').click()
    await page.getByTestId('organisation-dialog').waitFor({ state: 'detached' })

    const row = page.getByTestId('organisation-table').locator('tbody tr', { hasText: name })
    await expect.poll(() => row.textContent()).toContain('oskar@brackwater.test')
    await row.getByRole('button', { name: 'Deactivate' }).click()
    await page.getByTestId('confirm-deactivate').click()
    await expect.poll(() => row.textContent()).toContain('Deactivated')
    await expect.poll(() => page.getByRole('alertdialog').count()).toBe(0)
    await waitForTable(page)
    await screenshot(page, 'organisations')

    expect(browser().errors).toEqual([])
  })
})
