import { readFileSync } from 'node:fs'
import { resolve } from 'node:path'
import type { APIRequestContext, Locator, Page } from 'playwright-core'
import sharp from 'sharp'
import { describe, expect, inject, it } from 'vitest'
import { openBrowser, screenshot, signIn, unexpectedErrors, useBrowser } from '../helpers/browser'

const browser = useBrowser()
// Open 42CrMoS4 record (CC BY 4.0, see tests/fixtures/tensile-42CrMoS4/README.md).
const RECORD = resolve(import.meta.dirname, '../fixtures/tensile-42CrMoS4/46NT73.csv')

/** The API as the signed-in page: its cookies, and the CSRF token of its session. */
async function apiOf(page: Page, base: string) {
  const api: APIRequestContext = page.request
  const csrf = (await (await api.get(`${base}/api/auth/csrf`)).json()).data.token as string
  const send = async (method: 'post', path: string, options: object) => {
    const response = await api[method](`${base}${path}`, {
      headers: { 'X-CSRF-Token': csrf },
      ...options,
    })
    expect(response.ok(), `${path}: ${await response.text()}`).toBe(true)
    return (await response.json()).data
  }
  return {
    get: async (path: string) => (await (await api.get(`${base}${path}`)).json()).data,
    post: (path: string, data: object) => send('post', path, { data }),
    upload: (path: string, multipart: object) => send('post', path, { multipart }),
  }
}

const shadedJpeg = (shade: string) =>
  sharp({ create: { width: 640, height: 480, channels: 3, background: shade } })
    .jpeg()
    .toBuffer()

/**
 * A fresh case led by the investigator, with two photographs, two observations and a tensile
 * confirmed tensile record from the lab technician: everything a discussion draws on.
 */
async function caseWithEvidence(page: Page, base: string): Promise<number> {
  const api = await apiOf(page, base)
  const staff = (await api.get('/api/staff')) as { id: number; name: string; roles: string[] }[]
  const idOf = (name: string) => staff.find((person) => person.name === name)?.id
  const organisations = (await api.get('/api/organisations')) as { id: number; name: string }[]
  const created = await api.post('/api/cases', {
    title: 'Cracked lifting lug on a spreader beam',
    organisationId: organisations[0]?.id,
    component: 'Lifting lug',
    material: '42CrMo4',
    leadInvestigatorId: idOf('Tomas Reyke'),
    labTechnicianId: idOf('Priya Olund'),
  })
  const caseId = created.id as number
  for (const [name, shade] of [
    ['lug fracture face.jpg', '#666666'],
    ['lug overall.jpg', '#999999'],
  ] as const) {
    const buffer = await shadedJpeg(shade)
    await api.upload(`/api/cases/${caseId}/photos`, {
      file: { name, mimeType: 'image/jpeg', buffer },
    })
  }
  for (const text of [
    'Beach marks converge on the lug hole bore at the three o’clock position.',
    'The lug hole bore shows fretting where the shackle pin bore on it.',
  ])
    await api.post(`/api/cases/${caseId}/observations`, { text })
  await api.post(`/api/cases/${caseId}/status`, { status: 'examination' })

  const labSession = await openBrowser()
  try {
    await signIn(labSession.page, base, 'lab@demo.test', inject('demoPassword'))
    const lab = await apiOf(labSession.page, base)
    const specimen = await lab.post(`/api/cases/${caseId}/specimens`, { label: 'L1' })
    const path = `/api/cases/${caseId}/specimens/${specimen.id}/tensile-records`
    const record = await lab.upload(path, {
      options: JSON.stringify({ spec: '42CrMo4+QT', fitRange: '100:400MPa' }),
      file: { name: '46NT73.csv', mimeType: 'text/csv', buffer: readFileSync(RECORD) },
    })
    await lab.post(`/api/cases/${caseId}/tensile-records/${record.id}/confirm`, { version: 1 })
  } finally {
    await labSession.close()
  }
  return caseId
}

const editorOf = (page: Page) => page.getByTestId('findings-text')

/** Puts the cursor at the end of the paragraph under a template section heading. */
async function writeUnder(page: Page, section: string, text: string) {
  const paragraph = editorOf(page).locator(`[data-section="${section}"] + p`)
  await paragraph.click()
  await page.keyboard.press('End')
  if (text) await page.keyboard.type(text)
}

async function insertFigure(page: Page, photoIndex: number, caption: string) {
  await page.getByTestId('insert-figure').click()
  const dialog = page.getByTestId('figure-dialog')
  await dialog.locator('[data-testid^="figure-photo-"]').nth(photoIndex).click()
  await page.getByTestId('figure-dialog-caption').fill(caption)
  await page.getByTestId('figure-dialog-insert').click()
  await dialog.waitFor({ state: 'detached' })
}

/** Opens an opinion's picker once and ticks the observations, then closes it. */
async function cite(page: Page, opinion: Locator, numbers: string[]) {
  await opinion.getByTestId('opinion-cites').click()
  for (const number of numbers) {
    await page.getByRole('option', { name: new RegExp(`^${number}:`) }).click()
    await expect.poll(() => opinion.getAttribute('data-cited')).toContain(number)
  }
  await page.keyboard.press('Escape')
}

const saved = (page: Page) =>
  expect.poll(() => page.getByTestId('save-state').getAttribute('data-state'))

describe('the findings draft', () => {
  it('writes a discussion with figures, live results and cited opinions; a stale tab keeps its text', async () => {
    const { page, context, errors } = browser()
    const base = inject('baseUrl')
    // a step that cannot happen fails with its own message, well within the test's time
    context.setDefaultTimeout(20_000)
    await signIn(page, base, 'investigator@demo.test', inject('demoPassword'))
    const caseId = await caseWithEvidence(page, base)
    await page.goto(`${base}/cases/${caseId}/findings`)
    await saved(page).toBe('saved')
    expect(await page.getByTestId('save-state').textContent()).toContain('Nothing saved yet')

    // the discussion: a figure of a case photo, then the text that refers to it
    await writeUnder(page, 'discussion', '')
    await insertFigure(page, 0, 'Fracture face of the lug')
    await page.keyboard.type('Beach marks run from the bore (see ')
    await page.getByTestId('insert-figure-ref').click()
    await page.getByTestId('figure-ref-dialog').getByTestId('choice-confirm').click()
    await page.keyboard.type('), at 20 °C ')
    await page.getByTestId('symbol-plus-minus').click()
    await page.keyboard.type(' 2.')
    const figureLabel = page.getByTestId('figure-label')
    await expect.poll(() => figureLabel.first().textContent()).toBe('Figure 1.')
    await expect.poll(() => page.getByTestId('figure-ref').first().textContent()).toBe('Figure 1')

    // the live tensile results table follows the confirmed record
    await page.getByTestId('insert-live-block').click()
    await page.getByTestId('live-block-dialog').getByTestId('choice-confirm').click()
    const live = page.getByTestId('live-block')
    await expect.poll(() => live.textContent()).toContain('L1')
    expect(await live.textContent()).toContain('Rm')

    // a conclusion citing two observations carries no flag
    await writeUnder(page, 'conclusions', '')
    await page.getByTestId('insert-opinion').click()
    await page.keyboard.type('The lug failed by fatigue from the fretted bore.')
    const conclusion = page.getByTestId('opinion').first()
    await cite(page, conclusion, ['O-1', 'O-2'])
    await expect.poll(() => conclusion.getAttribute('data-cited')).toBe('O-1,O-2')
    expect(await conclusion.getByTestId('opinion-flag').count()).toBe(0)

    // an opinion citing nothing is flagged to the author, in the text and in the list
    await writeUnder(page, 'recommendations', '')
    await page.getByTestId('insert-opinion').click()
    await page.keyboard.type('Replace the lugs of the other spreader beams.')
    const uncited = page.getByTestId('opinion').nth(1)
    expect(await uncited.getByTestId('opinion-flag').textContent()).toContain(
      'Cites no observation',
    )
    await saved(page).toBe('saved')
    await expect
      .poll(() => page.getByTestId('findings-flags').textContent())
      .toContain('Opinion 2 cites no observation')

    // a second figure above the first renumbers it and its reference
    await writeUnder(page, 'visual', '')
    await insertFigure(page, 1, 'The lug as received')
    await expect.poll(() => figureLabel.allTextContents()).toEqual(['Figure 1.', 'Figure 2.'])
    expect(await page.getByTestId('figure-caption').nth(1).inputValue()).toBe(
      'Fracture face of the lug',
    )
    await expect.poll(() => page.getByTestId('figure-ref').first().textContent()).toBe('Figure 2')
    await saved(page).toBe('saved')
    await screenshot(page, 'findings-editor')

    const api = await apiOf(page, base)
    const stored = await api.get(`/api/cases/${caseId}/findings`)
    expect(stored.html).toContain('Figure 2. Fracture face of the lug')
    expect(stored.html).toContain('Opinion, based on O-1, O-2')
    expect(stored.html).toMatch(/class="figure-ref"[^>]*>Figure 2<\/a>/)
    expect(stored.flags.map((flag: { kind: string }) => flag.kind)).toEqual(['opinion_uncited'])

    // a second tab opened now goes stale once the first saves again
    const stale = await context.newPage()
    await stale.goto(`${base}/cases/${caseId}/findings`)
    await saved(stale).toBe('saved')
    await writeUnder(page, 'summary', 'Fatigue from the lug bore.')
    await saved(page).toBe('saved')
    await writeUnder(stale, 'summary', 'Text only the stale tab has.')
    await saved(stale).toBe('conflict')
    await stale.getByTestId('findings-conflict').waitFor()
    expect(await editorOf(stale).textContent()).toContain('Text only the stale tab has.')
    expect(await stale.getByTestId('their-text').textContent()).toContain(
      'Fatigue from the lug bore.',
    )
    const kept = await stale.evaluate(
      (key) => localStorage.getItem(key),
      `fractolog:findings:${caseId}:draft`,
    )
    expect(kept).toContain('Text only the stale tab has.')
    await screenshot(stale, 'findings-conflict')

    // taking theirs puts their text in the editor and keeps the writer's beside it
    await stale.getByTestId('take-theirs').click()
    await expect.poll(() => editorOf(stale).textContent()).toContain('Fatigue from the lug bore.')
    expect(await stale.getByTestId('your-text').textContent()).toContain(
      'Text only the stale tab has.',
    )
    await screenshot(stale, 'findings-merge')
    await stale.close()

    const expected = [{ status: 409, path: `/cases/${caseId}/findings` }]
    expect(unexpectedErrors(errors, expected)).toEqual([])
  })
})
