import { describe, expect, inject, it } from 'vitest'
import { screenshot, signIn, unexpectedErrors, useBrowser, waitForTable } from '../helpers/browser'
import { totpCode } from '../helpers/totp-code'

const browser = useBrowser()

describe('a new staff member', () => {
  it('is added by an administrator, signs in with the one-time password, sets their own and a second factor', async () => {
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

    // staff set up a second factor before anything else: the key as a QR code and as text
    await page.waitForURL(/\/second-factor\?redirect=(%2F|\/)cases/)
    const keyText = page.getByTestId('second-factor-key')
    await expect.poll(() => keyText.isVisible()).toBe(true)
    const key = ((await keyText.textContent()) ?? '').trim()
    expect(key).toMatch(/^[A-Z2-7]{32}$/)
    expect(await page.locator('img[alt="QR code of the key"]').getAttribute('src')).toMatch(
      /^data:image\/png;base64,/,
    )
    await page.goto(`${base}/cases`)
    await page.waitForURL(/\/second-factor/)
    await expect.poll(() => keyText.isVisible()).toBe(true)
    const newKey = ((await keyText.textContent()) ?? '').trim()
    await screenshot(page, 'second-factor-setup')
    // the code an authenticator app would show, computed here from the key (RFC 6238)
    await page.locator('#enrol-code').fill(totpCode(newKey))
    await page.getByTestId('confirm-second-factor').click()
    const codes = page.getByTestId('recovery-codes').locator('li')
    await expect.poll(() => codes.count()).toBe(10)
    await screenshot(page, 'recovery-codes')
    await page.getByTestId('recovery-codes-kept').click()

    await page.waitForURL(`${base}/cases`)
    await expect
      .poll(() => page.getByTestId('signed-in-name').textContent())
      .toBe('Aino Vesterlund')
    await expect.poll(() => page.getByTestId('case-table').isVisible()).toBe(true)
    await waitForTable(page)
    await screenshot(page, 'first-case-list')

    // the next sign-in asks for the code
    await page.getByTestId('sign-out').click()
    await page.waitForURL(`${base}/sign-in`)
    await page.locator('#email').fill(email)
    await page.locator('#password').fill(ownPassword)
    await page.getByTestId('sign-in-submit').click()
    await page.getByTestId('second-factor-form').waitFor()
    await page.locator('#second-factor-code').fill('000000')
    await page.getByTestId('second-factor-submit').click()
    await expect.poll(() => page.getByTestId('form-error').textContent()).toContain('not correct')
    await screenshot(page, 'second-factor-refused')
    await page.locator('#second-factor-code').fill(totpCode(newKey, Date.now() + 30_000))
    await page.getByTestId('second-factor-submit').click()
    await page.waitForURL(`${base}/`)
    expect(await page.getByTestId('signed-in-name').textContent()).toBe('Aino Vesterlund')

    const expected = [{ status: 401, path: '/auth/second-factor' }]
    expect(unexpectedErrors(browser().errors, expected)).toEqual([])
  })
})
