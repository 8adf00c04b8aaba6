import { describe, expect, inject, it } from 'vitest'
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
    const sentRow = page.getByTestId('outbox-table').locator('tbody tr').first()
    await expect.poll(() => sentRow.textContent()).toMatch(/FL-\d{4}-\d{4}: you are the/)
    await screenshot(page, 'outbox')

    await page.getByTestId('nav-mail-sent').click()
    await page.waitForURL(`${base}/admin/mail`)
    const first = page.getByTestId('mail-table').locator('tbody tr').first()
    await expect.poll(() => first.textContent()).toMatch(/FL-\d{4}-\d{4}: you are the/)
    await first.getByRole('button').click()
    await expect
      .poll(() => page.getByTestId('mail-text').textContent())
      .toMatch(/: https?:\/\/\S+\/cases\/\d+\n/)
    await screenshot(page, 'mail-sent')

    expect(browser().errors).toEqual([])
  })
})
