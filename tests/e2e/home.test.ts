import { describe, expect, inject, it } from 'vitest'
import { screenshot, unexpectedErrors, useBrowser } from '../helpers/browser'

const browser = useBrowser()

describe('the start page', () => {
  it('sends a visitor to sign-in, with the bundled font, no console errors and no request to another host', async () => {
    const base = inject('baseUrl')
    const foreign: string[] = []
    browser().page.on('request', (req) => {
      if (!req.url().startsWith(base) && !req.url().startsWith('data:')) foreign.push(req.url())
    })
    await browser().page.goto(base)
    await browser().page.waitForURL(`${base}/sign-in`)
    await expect.poll(() => browser().page.getByText('Fractolog').first().isVisible()).toBe(true)
    await expect.poll(() => browser().page.getByTestId('sign-in-form').isVisible()).toBe(true)
    const fontLoaded = await browser().page.evaluate(async () => {
      await document.fonts.ready
      return document.fonts.check('16px "Merriweather Sans"')
    })
    expect(fontLoaded).toBe(true)
    await screenshot(browser().page, 'sign-in')
    // asking who is signed in answers 200 even signed out, so nothing is logged as an error
    expect(browser().errors).toEqual([])
    expect(foreign).toEqual([])
  })

  it('shows the not-found page for an unknown address', async () => {
    await browser().page.goto(`${inject('baseUrl')}/no/such/page`)
    await expect.poll(() => browser().page.getByTestId('not-found').isVisible()).toBe(true)
  })

  it('refuses a wrong password with one plain message', async () => {
    const page = browser().page
    await page.goto(`${inject('baseUrl')}/sign-in`)
    await page.locator('#email').fill('investigator@demo.test')
    await page.locator('#password').fill('not-the-password')
    await page.getByTestId('sign-in-submit').click()
    await expect
      .poll(() => page.getByTestId('form-error').textContent())
      .toContain('e-mail address or password is not correct')
    expect(page.url()).toBe(`${inject('baseUrl')}/sign-in`)
    await screenshot(page, 'sign-in-refused')
    const refusedSignIn = { status: 401, path: '/auth/login' }
    expect(unexpectedErrors(browser().errors, [refusedSignIn])).toEqual([])
  })
})
