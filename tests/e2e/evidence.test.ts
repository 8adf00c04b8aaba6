import { request, type APIRequestContext } from 'playwright-core'
import { describe, expect, inject, it } from 'vitest'
import { todayIso } from '../../shared/schemas/dates'
import { plainJpeg } from '../factories/images'
import { seriousAccessibilityProblems } from '../helpers/accessibility'
import {
  apiSignIn,
  screenshot,
  signIn,
  unexpectedErrors,
  useBrowser,
  waitForTable,
} from '../helpers/browser'

const browser = useBrowser()

async function apiAs(email: string): Promise<APIRequestContext> {
  const api = await request.newContext({ baseURL: inject('baseUrl') })
  expect(await apiSignIn(api, email, inject('demoPassword'))).toBe(200)
  return api
}

/** A fresh case of the fittings company naming one interested party, opened through the API. */
async function openCase(): Promise<number> {
  const api = await apiAs('investigator@demo.test')
  try {
    const organisations = (await (await api.get('/api/organisations')).json()).data as {
      id: number
      name: string
    }[]
    const fittings = organisations.find(({ name }) => name === 'Quillon Process Fittings')
    const csrf = (await (await api.get('/api/auth/csrf')).json()).data.token as string
    const created = await api.post('/api/cases', {
      headers: { 'X-CSRF-Token': csrf },
      data: {
        title: 'Split flange bolt from a relief line',
        organisationId: fittings?.id,
        component: 'Flange bolt',
        material: '42CrMo4',
        interestedParties: [
          { name: 'Harriet Vosk', organisation: 'Ellerwick Mutual', email: null, role: 'insurer' },
        ],
      },
    })
    expect(created.status(), await created.text()).toBe(201)
    return (await created.json()).data.id as number
  } finally {
    await api.dispose()
  }
}

/** A photograph of the case, uploaded through the API as the lead investigator. */
async function uploadPhoto(caseId: number): Promise<void> {
  const api = await apiAs('investigator@demo.test')
  try {
    const csrf = (await (await api.get('/api/auth/csrf')).json()).data.token as string
    const uploaded = await api.post(`/api/cases/${caseId}/photos`, {
      headers: { 'X-CSRF-Token': csrf },
      multipart: {
        file: { name: 'thread-root.jpg', mimeType: 'image/jpeg', buffer: await plainJpeg() },
      },
    })
    expect(uploaded.status(), await uploaded.text()).toBe(201)
  } finally {
    await api.dispose()
  }
}

describe('the evidence of a case', () => {
  it('takes an item from receipt through notice, sectioning and transfer to an observation', async () => {
    const page = browser().page
    const base = inject('baseUrl')
    const caseId = await openCase()
    await uploadPhoto(caseId)
    await signIn(page, base, 'investigator@demo.test', inject('demoPassword'))

    // receive the item
    await page.goto(`${base}/cases/${caseId}/evidence`)
    await page.waitForURL(`${base}/cases/${caseId}/evidence/samples`)
    await page.getByTestId('receive-sample').click()
    await page.locator('#sample-description').fill('Flange bolt, both halves, thread end rusted')
    await page.locator('#sample-received-from').fill('Site engineer, relief line R-7')
    await page.locator('#sample-collected-by').fill('K. Amsel')
    await page.locator('#sample-location').fill('Evidence store, shelf 1')
    await page.getByTestId('save-sample').click()
    await page.waitForURL(/\/evidence\/samples\/\d+$/)
    const itemId = (await page.getByTestId('sample-item-id').textContent())?.trim() ?? ''
    expect(itemId).toMatch(/^FL-\d{4}-\d{4}-S1$/)

    // sectioning is refused until a notice allows it
    await page.getByTestId('cut-piece').click()
    await page.locator('#sample-description').fill('Fracture origin, longitudinal section')
    await page.locator('#sample-cut-location').fill('First engaged thread')
    await page.getByTestId('save-sample').click()
    await expect
      .poll(() => page.getByTestId('sample-form-error').textContent())
      .toContain('No notice covers')
    await page.keyboard.press('Escape')

    // record the notice and the party's agreement
    await page.getByTestId('evidence-notices').click()
    await page.getByTestId('record-notice').click()
    await page.getByTestId('notice-items').click()
    await page.getByRole('option', { name: itemId }).click()
    await page.keyboard.press('Escape')
    await page.locator('#notice-work').fill('Section the origin for metallography')
    await page.locator('#notice-planned-on').fill(todayIso())
    await page.locator('#notice-authorised-by').fill('Client, plant manager')
    await page.getByTestId('save-notice').click()
    await expect.poll(() => page.getByTestId('notice-standing').textContent()).toContain('Waiting')
    await page.getByRole('button', { name: 'Record answer' }).click()
    await page.locator('#answer-comment').fill('Agreed by phone; will not attend.')
    await page.getByTestId('save-answer').click()
    await expect
      .poll(() => page.getByTestId('notice-standing').textContent())
      .toContain('Every party agreed')
    await screenshot(page, 'evidence-notice')
    const problems: string[] = []
    const checkAccessibility = async (screen: string) =>
      problems.push(...(await seriousAccessibilityProblems(page)).map((l) => `${screen}: ${l}`))
    await checkAccessibility('notices')

    // section it, then transfer the piece to the lab
    await page.getByTestId('evidence-samples').click()
    await page.getByTestId(`sample-${itemId}`).click()
    await page.getByTestId('cut-piece').click()
    await page.locator('#sample-description').fill('Fracture origin, longitudinal section')
    await page.locator('#sample-cut-location').fill('First engaged thread')
    await page.locator('#sample-orientation').fill('Longitudinal, through the origin')
    await page.getByTestId('save-sample').click()
    await expect.poll(() => page.getByTestId('pieces').textContent()).toContain(`${itemId}.1`)
    await page.getByTestId('pieces').getByText(`${itemId}.1`).click()
    await expect.poll(() => page.getByTestId('sample-item-id').textContent()).toBe(`${itemId}.1`)
    await page.getByTestId('record-custody').click()
    await page.locator('#custody-to').fill('Metallography lab')
    await page.locator('#custody-purpose').fill('Mount and polish')
    await page.locator('#custody-location').fill('Metallography lab, cabinet B')
    await page.getByTestId('save-custody').click()
    const history = page.getByTestId('custody-history')
    await expect.poll(() => history.textContent()).toContain('Metallography lab')
    expect(await page.getByTestId('gap-tag').count()).toBe(0)
    expect(await page.getByTestId('flag-custody_gap').count()).toBe(0)
    await waitForTable(page)
    await screenshot(page, 'evidence-item')
    await checkAccessibility('item')
    const pieceUrl = page.url()

    // record an observation citing the item
    await page.getByTestId('evidence-observations').click()
    await page.locator('#observation-text').fill('Beach marks run from the first engaged thread.')
    await page.getByTestId('observation-items').click()
    await page.getByRole('option', { name: `${itemId}.1` }).click()
    await page.keyboard.press('Escape')
    await page.getByTestId('observation-photos').click()
    await page.getByRole('option', { name: 'thread-root.jpg' }).click()
    await page.keyboard.press('Escape')
    await page.getByTestId('save-observation').click()
    await expect
      .poll(() => page.getByTestId('observation-O-1').textContent())
      .toContain(`${itemId}.1`)
    // the photo it cites is shown and opens in the viewer
    const cited = page.getByTestId('observation-O-1').getByRole('link', { name: 'thread-root.jpg' })
    await cited.click()
    await page.getByTestId('photo-viewer').waitFor()
    await page.goBack()
    await screenshot(page, 'evidence-observations')
    await checkAccessibility('observations')

    // the label sheet carries a QR code for each item
    await page.goto(`${base}/cases/${caseId}/evidence/labels`)
    const label = page.getByTestId(`label-${itemId}.1`)
    await expect.poll(() => label.locator('img').getAttribute('src')).toMatch(/^data:image\/png/)
    await screenshot(page, 'evidence-labels')
    // printed, the sheet shows alone: the app's bars and buttons are hidden
    await page.emulateMedia({ media: 'print' })
    const seen = (testId: string) =>
      page.getByTestId(testId).evaluate((element) => getComputedStyle(element).visibility)
    expect(await seen('label-sheet')).toBe('visible')
    expect(await seen('print-labels')).toBe('hidden')
    expect(await seen('case-sections')).toBe('hidden')
    await page.emulateMedia({ media: 'screen' })
    await checkAccessibility('labels')
    await page.getByTestId('evidence-samples').click()
    await waitForTable(page)
    await checkAccessibility('samples')
    expect(problems).toEqual([])
    expect(
      unexpectedErrors(browser().errors, [
        { status: 401, path: '/auth/me' },
        { status: 409, path: `/cases/${caseId}/samples` },
      ]),
    ).toEqual([])

    // a client of another organisation reaches none of it by URL
    await page.getByTestId('sign-out').click()
    await signIn(page, base, 'client@demo.test', inject('demoPassword'))
    for (const url of [pieceUrl, `${base}/cases/${caseId}/evidence/observations`]) {
      await page.goto(url)
      await expect.poll(() => page.locator('body').textContent()).toMatch(/not found/i)
    }
    const api = await apiAs('client@demo.test')
    for (const path of ['samples', 'notices', 'observations', 'holds']) {
      expect((await api.get(`/api/cases/${caseId}/${path}`)).status(), path).toBe(404)
    }
    await api.dispose()
  }, 180_000) // a long journey: generous on a busy machine
})
