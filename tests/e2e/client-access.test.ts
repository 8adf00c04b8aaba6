import { request } from 'playwright-core'
import { describe, expect, inject, it } from 'vitest'
import {
  apiSignIn,
  screenshot,
  signIn,
  unexpectedErrors,
  waitForTable,
  useBrowser,
} from '../helpers/browser'

const browser = useBrowser()

/** Asks the API, signed in as the investigator, for the id of a case of the given organisation. */
async function caseIdOf(organisationName: string): Promise<number> {
  const api = await request.newContext({ baseURL: inject('baseUrl') })
  try {
    expect(await apiSignIn(api, 'investigator@demo.test', inject('demoPassword'))).toBe(200)
    const organisations = (await (await api.get('/api/organisations')).json()).data as {
      id: number
      name: string
    }[]
    const organisation = organisations.find(({ name }) => name === organisationName)
    expect(organisation).toBeDefined()
    const cases = await api.get(`/api/cases?organisationId=${organisation?.id}`)
    const [first] = (await cases.json()).data as { id: number }[]
    expect(first).toBeDefined()
    return first?.id ?? 0
  } finally {
    await api.dispose()
  }
}

describe('a client', () => {
  it("sees only the own organisation's cases and not-found for another's case", async () => {
    const page = browser().page
    const base = inject('baseUrl')
    const otherCaseId = await caseIdOf('Quillon Process Fittings')

    await signIn(page, base, 'client@demo.test', inject('demoPassword'))
    await page.waitForURL(`${base}/`)
    await page.getByTestId('nav-cases').click()
    await page.waitForURL(`${base}/cases`)
    const table = page.getByTestId('case-table')
    await expect.poll(() => table.textContent()).toContain('Fractured hook block pin')
    const listed = (await table.textContent()) ?? ''
    expect(listed).toContain('Sheared boom foot bolt')
    expect(listed).not.toContain('Cracked compression fitting')
    expect(listed).not.toContain('Transfer pump shaft fracture')
    expect(await page.getByTestId('new-case').count()).toBe(0)
    expect(await page.getByTestId('organisation-filter').count()).toBe(0)
    expect(await page.getByTestId('nav-people').count()).toBe(0)
    await waitForTable(page)
    await screenshot(page, 'client-case-list')

    expect(listed).not.toContain('Drafting')
    expect(listed).toContain('Report in preparation')
    await page.getByTestId('stage-filter').selectOption({ label: 'Under examination' })
    await page.waitForURL(`${base}/cases?stage=under_examination`)
    await page.reload()
    // other journeys may move more of this client's cases along: judge only what the filter shows
    const rows = table.locator('tbody tr')
    await expect.poll(() => table.textContent()).toContain('Fractured hook block pin')
    const stages = await rows.getByTestId('client-stage').allTextContents()
    expect(stages.length).toBeGreaterThan(0)
    expect(new Set(stages)).toEqual(new Set(['Under examination']))
    expect(await table.textContent()).not.toContain('Cracked rope sheave')
    await table.getByText('Fractured hook block pin').click()
    await page.waitForURL(/\/cases\/\d+$/)
    await expect
      .poll(() => page.getByTestId('client-stage').textContent())
      .toBe('Under examination')
    expect(await page.getByTestId('case-client-reference').textContent()).toBe('TC-NCR-2291')
    expect(await page.getByTestId('case-sections').count()).toBe(0)
    expect(await page.getByTestId('status-control').count()).toBe(0)
    await screenshot(page, 'client-case-line')

    await page.goto(`${base}/cases/${otherCaseId}`)
    await expect.poll(() => page.getByTestId('not-found').isVisible()).toBe(true)
    expect(await page.getByTestId('case-page').count()).toBe(0)
    await screenshot(page, 'client-other-case')

    await page.goto(`${base}/admin/people`)
    await expect.poll(() => page.getByTestId('not-found').isVisible()).toBe(true)

    expect(
      unexpectedErrors(browser().errors, [{ status: 404, path: `/cases/${otherCaseId}` }]),
    ).toEqual([])
  })
})
