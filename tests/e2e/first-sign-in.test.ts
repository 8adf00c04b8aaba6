import { describe, expect, inject, it } from 'vitest'
import { screenshot, signIn, waitForTable, useBrowser } from '../helpers/browser'

const browser = useBrowser()

describe('a new staff member', () => {
  it('is added by an administrator, signs in with the one-time password and sets their own', async () => {
    const page = browser().page
    const base = inject('baseUrl')
    const email = `lab.${Date.now()}@demo.test`
    const ownPassword = 'fatigue-striations-42'

    await signIn(page, base, 'admin@demo.test', inject('demoPassword'))
    await page.getByTestId('nav-people').click()
    await page.waitForURL(`${base}/admin/people`)
    await page.getByTestId('add-person').click()
    await page.locator('#person-name').fill('Aino Vesterlund')
    await page.locator('#person-email').fill(email)
    await page.getByTestId('role-lab').click()
    await page.getByTestId('save-person').click()

    const secret = page.getByTestId('one-time-password')
    await expect.poll(() => secret.isVisible()).toBe(true)
    const oneTimePassword = ((await secret.textContent()) ?? '').trim()
    expect(oneTimePassword.length).toBeGreaterThanOrEqual(12)
    await page.getByTestId('person-dialog').waitFor({ state: 'detached' })
    await screenshot(page, 'one-time-password')
    await page.getByTestId('close-one-time-password').click()
    await page.getByTestId('one-time-password-dialog').waitFor({ state: 'detached' })
    await expect.poll(() => page.getByTestId('people-table').textContent()).toContain(email)
    await waitForTable(page)
    await screenshot(page, 'people')

    await page.getByTestId('sign-out').click()
    await page.waitForURL(`${base}/sign-in`)
    await signIn(page, base, email, oneTimePassword)
    await page.waitForURL(`${base}/set-password`)
    expect(await page.getByTestId('nav-cases').count()).toBe(0)

    await page.goto(`${base}/cases`)
    await page.waitForURL(/\/set-password/)
    await page.locator('#current-password').fill(oneTimePassword)
    await page.locator('#new-password').fill('short')
    await page.locator('#repeat-password').fill('short')
    await page.getByTestId('set-password-submit').click()
    await expect
      .poll(() => page.getByTestId('new-password-error').textContent())
      .toBe('Use at least 12 characters.')
    await page.locator('#new-password').fill(ownPassword)
    await page.locator('#repeat-password').fill(ownPassword)
    await screenshot(page, 'set-password')
    await page.getByTestId('set-password-submit').click()

    await page.waitForURL(`${base}/cases`)
    await expect
      .poll(() => page.getByTestId('signed-in-name').textContent())
      .toBe('Aino Vesterlund')
    await expect.poll(() => page.getByTestId('case-table').isVisible()).toBe(true)
    await waitForTable(page)
    await screenshot(page, 'first-case-list')

    expect(browser().errors).toEqual([])
  })
})
