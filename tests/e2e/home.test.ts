import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import { openBrowser, screenshot, type BrowserSession } from '../helpers/browser'

let browser: BrowserSession

beforeAll(async () => {
  browser = await openBrowser()
})
afterAll(() => browser.close())

describe('the home page', () => {
  it('loads with the bundled font, no console errors and no request to another host', async () => {
    const base = inject('baseUrl')
    const foreign: string[] = []
    browser.page.on('request', (req) => {
      if (!req.url().startsWith(base) && !req.url().startsWith('data:')) foreign.push(req.url())
    })
    await browser.page.goto(base)
    await expect.poll(() => browser.page.getByText('Fractolog').first().isVisible()).toBe(true)
    const fontLoaded = await browser.page.evaluate(async () => {
      await document.fonts.ready
      return document.fonts.check('16px "Merriweather Sans"')
    })
    expect(fontLoaded).toBe(true)
    await screenshot(browser.page, 'home')
    expect(browser.errors).toEqual([])
    expect(foreign).toEqual([])
  })

  it('shows the not-found page for an unknown address', async () => {
    await browser.page.goto(`${inject('baseUrl')}/no/such/page`)
    await expect.poll(() => browser.page.getByTestId('not-found').isVisible()).toBe(true)
  })
})
