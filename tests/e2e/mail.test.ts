import { describe, expect, inject, it } from 'vitest'
import { seriousAccessibilityProblems } from '../helpers/accessibility'
import { screenshot, signIn, useBrowser } from '../helpers/browser'

const browser = useBrowser()

describe('an administrator reading the mail of the demo', () => {
  it('sees the assignment notices in the outbox as sent and reads one on the "Mail sent" page', async () => {
    const page = browser().page
    const base = inject('baseUrl')
    await signIn(page, base, 'admin@demo.test', inject('demoPassword'))

    // the demo's cases were opened with their people, so each was told by e-mail
    await page.getByTestId('nav-outbox').click()
    await page.waitForURL(`${base}/admin/outbox`)
    await page.getByTestId('outbox-status').selectOption({ label: 'Sent' })
    // the demo's issued reports were told to the clients too: pick an assignment notice
    const sentRow = page
      .getByTestId('outbox-table')
      .locator('tbody tr', { hasText: /: you are the/ })
      .first()
    await expect.poll(() => sentRow.textContent()).toMatch(/FL-\d{4}-\d{4}: you are the/)
    await screenshot(page, 'outbox')

    await page.getByTestId('nav-mail-sent').click()
    await page.waitForURL(`${base}/admin/mail`)
    const first = page
      .getByTestId('mail-table')
      .locator('tbody tr', { hasText: /: you are the/ })
      .first()
    await expect.poll(() => first.textContent()).toMatch(/FL-\d{4}-\d{4}: you are the/)
    await first.getByRole('button').click()
    await expect
      .poll(() => page.getByTestId('mail-text').textContent())
      .toMatch(/: https?:\/\/\S+\/cases\/\d+\n/)
    await screenshot(page, 'mail-sent')
    await page.getByTestId('sign-out').click()
    await page.waitForURL(`${base}/sign-in`)

    expect(browser().errors).toEqual([])
  })

  it('a client turns off the answer notice; the issued-report notice cannot be turned off', async () => {
    const page = browser().page
    const base = inject('baseUrl')
    await signIn(page, base, 'client@demo.test', inject('demoPassword'))
    await page.getByTestId('nav-notice-settings').click()
    await page.waitForURL(`${base}/settings/notices`)
    const answer = page.getByTestId('notice-answer').locator('input')
    const issued = page.getByTestId('notice-report_issued').locator('input')
    await expect.poll(() => answer.isChecked()).toBe(true)
    expect(await issued.isChecked()).toBe(true)
    expect(await issued.isDisabled()).toBe(true)
    expect(await seriousAccessibilityProblems(page)).toEqual([])

    await answer.uncheck()
    await page.getByTestId('save-notices').click()
    await page.getByTestId('notices-saved').waitFor()
    await screenshot(page, 'notice-settings')
    await page.reload()
    await expect
      .poll(() => page.getByTestId('notice-report_issued').locator('input').isChecked())
      .toBe(true)
    expect(await page.getByTestId('notice-answer').locator('input').isChecked()).toBe(false)

    // put the demo back as it was for the other tests
    await page.getByTestId('notice-answer').locator('input').check()
    await page.getByTestId('save-notices').click()
    await page.getByTestId('notices-saved').waitFor()
    expect(browser().errors).toEqual([])
  })
})
