import { request, type APIRequestContext, type Page } from 'playwright-core'
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import { apiSignIn, screenshot, signIn, unexpectedErrors, useBrowser } from '../helpers/browser'

const browser = useBrowser()
const TITLE = 'Sheared boom foot bolt'
let caseId = 0
let investigatorApi: APIRequestContext
let token = ''

/** The investigator's own API session, for what the findings editor (not this journey) does. */
async function apiAs(email: string): Promise<APIRequestContext> {
  const api = await request.newContext({ baseURL: inject('baseUrl') })
  // password, then the second factor's code, as a person signs in
  expect(await apiSignIn(api, email, inject('demoPassword'))).toBe(200)
  token = (await (await api.get('/api/auth/csrf')).json()).data.token
  return api
}

const paragraph = (text: string) => ({ type: 'paragraph', content: [{ type: 'text', text }] })
const heading = (section: string, text: string) => ({
  type: 'heading',
  attrs: { level: 2, section },
  content: [{ type: 'text', text }],
})

/** Saves the draft as the findings editor would. */
async function writeDraft(conclusion: string) {
  const current = await (await investigatorApi.get(`/api/cases/${caseId}/findings`)).json()
  const doc = {
    type: 'doc',
    content: [
      heading('summary', 'Summary'),
      paragraph('The bolt sheared in overload after the joint lost its clamp load.'),
      heading('conclusions', 'Conclusions'),
      paragraph(conclusion),
    ],
  }
  const saved = await investigatorApi.put(`/api/cases/${caseId}/findings`, {
    headers: { 'X-CSRF-Token': token },
    data: { doc, version: current.data.version },
  })
  expect(saved.status()).toBe(200)
}

beforeAll(async () => {
  investigatorApi = await apiAs('investigator@demo.test')
  const found = await (
    await investigatorApi.get(`/api/cases?q=${encodeURIComponent('boom foot bolt')}`)
  ).json()
  caseId = (found.data as { id: number; title: string }[]).find((c) => c.title === TITLE)!.id
  await writeDraft('The bolt was under-tightened at assembly.')
})
afterAll(() => investigatorApi.dispose())

async function as(page: Page, email: string) {
  const base = inject('baseUrl')
  if (await page.getByTestId('sign-out').count()) {
    await page.getByTestId('sign-out').click()
    await page.waitForURL(/\/sign-in/)
  }
  await signIn(page, base, email, inject('demoPassword'))
}

async function openSection(page: Page, section: 'review' | 'reports') {
  await page.goto(`${inject('baseUrl')}/cases/${caseId}/${section}`)
  await expect.poll(() => page.getByTestId(`case-${section}`).isVisible()).toBe(true)
}

async function confirmStep(page: Page, button: string) {
  await page.getByTestId(button).click()
  await page.getByTestId('confirm-step').click()
}

const statusText = (page: Page) => page.getByTestId('case-status').textContent()

/** Selects a passage of the draft the way a reader drags over it. */
async function selectPassage(page: Page, passage: string) {
  await page.evaluate((text) => {
    const root = document.querySelector('[data-testid="draft-text"]') as HTMLElement
    const walker = document.createTreeWalker(root, NodeFilter.SHOW_TEXT)
    for (let node = walker.nextNode(); node; node = walker.nextNode()) {
      const at = node.textContent?.indexOf(text) ?? -1
      if (at < 0) continue
      const range = document.createRange()
      range.setStart(node, at)
      range.setEnd(node, at + text.length)
      window.getSelection()?.removeAllRanges()
      window.getSelection()?.addRange(range)
      return
    }
    throw new Error(`passage not found: ${text}`)
  }, passage)
}

describe('review, approval, issue, reading and amendment', () => {
  it('lets the investigator submit and the reviewer comment on a passage and ask for revisions', async () => {
    const page = browser().page

    await as(page, 'investigator@demo.test')
    await openSection(page, 'review')
    await confirmStep(page, 'submit-review')
    await expect.poll(() => statusText(page)).toContain('In review')

    await as(page, 'reviewer@demo.test')
    await openSection(page, 'review')
    await expect
      .poll(() => page.getByTestId('draft-text').textContent())
      .toContain('under-tightened')
    await selectPassage(page, 'under-tightened at assembly')
    await page.getByTestId('comment-on-selection').click()
    await expect
      .poll(() => page.getByTestId('comment-quote').textContent())
      .toContain('under-tightened at assembly')
    expect(await page.getByTestId('comment-section').inputValue()).toBe('conclusions')
    await page.getByTestId('comment-body').fill('What shows the bolt was under-tightened?')
    await page.getByTestId('add-comment').click()
    await expect.poll(() => page.getByTestId('comment-thread').count()).toBe(1)
    await page.getByTestId('request-revisions').click()
    await page.locator('#reason-text').fill('Give the evidence for the assembly torque.')
    await page.getByTestId('save-reason').click()
    await expect.poll(() => statusText(page)).toContain('Revisions requested')
    await screenshot(page, 'review-revisions-requested')
  })

  it('lets the investigator resolve and resubmit, the reviewer approve, the investigator issue', async () => {
    const page = browser().page

    await as(page, 'investigator@demo.test')
    await writeDraft(
      'The bolt was under-tightened at assembly: its neighbours held 15 % of the torque.',
    )
    await openSection(page, 'review')
    await page.getByTestId('reply-body').fill('Residual torque of the neighbours added.')
    await page.getByTestId('reply-body').press('Enter')
    await page.getByTestId('resolve-thread').click()
    await expect.poll(() => page.getByTestId('thread-resolved').count()).toBe(1)
    await confirmStep(page, 'submit-review')
    await expect.poll(() => statusText(page)).toContain('In review')

    await as(page, 'reviewer@demo.test')
    await openSection(page, 'review')
    await confirmStep(page, 'approve')
    await expect.poll(() => statusText(page)).toContain('Approved')
    await expect.poll(() => page.getByTestId('approval').textContent()).toContain('Maren Costa')
    await screenshot(page, 'review-approved')

    await as(page, 'investigator@demo.test')
    await openSection(page, 'review')
    await confirmStep(page, 'issue-report')
    await expect.poll(() => statusText(page)).toContain('Issued')
    await openSection(page, 'reports')
    await expect.poll(() => page.getByTestId('report-revision').textContent()).toBe('A')
    await screenshot(page, 'case-reports-revision-a')
  })

  it('lets the client read revision A, acknowledge and ask; the investigator answers', async () => {
    const page = browser().page
    const base = inject('baseUrl')

    await as(page, 'client@demo.test')
    await page.getByTestId('nav-reports').click()
    await page.waitForURL(`${base}/reports`)
    await page.getByTestId('report-row-A').filter({ hasText: TITLE }).getByRole('link').click()
    await page.waitForURL(/\/reports\/\d+$/)
    await expect.poll(() => page.getByTestId('report-text').textContent()).toContain('15 %')
    await page.getByTestId('acknowledge').click()
    await expect.poll(() => page.getByTestId('acknowledged').count()).toBe(1)
    await page.getByTestId('question-body').fill('Should the other boom foot bolts be replaced?')
    await page.getByTestId('send-question').click()
    await expect.poll(() => page.getByTestId('report-question').count()).toBe(1)
    await screenshot(page, 'client-report-question')

    await as(page, 'investigator@demo.test')
    await openSection(page, 'reports')
    await page.getByTestId('answer-body').fill('Yes: replace all eight and tighten by turn-of-nut.')
    await page.getByTestId('send-answer').click()
    await expect.poll(() => page.getByTestId('report-answer').count()).toBe(1)
  })

  it('makes revision B by an amendment with its reason, naming A, which stays readable', async () => {
    const page = browser().page
    await page.getByTestId('amend-report').click()
    await page.locator('#reason-text').fill('The client gave the correct bolt grade.')
    await page.getByTestId('save-reason').click()
    await expect.poll(() => statusText(page)).toContain('Drafting')
    await openSection(page, 'review')
    await confirmStep(page, 'submit-review')
    await expect.poll(() => statusText(page)).toContain('In review')

    await as(page, 'reviewer@demo.test')
    await openSection(page, 'review')
    await confirmStep(page, 'approve')
    await expect.poll(() => statusText(page)).toContain('Approved')

    await as(page, 'investigator@demo.test')
    await openSection(page, 'review')
    await confirmStep(page, 'issue-report')
    await expect.poll(() => statusText(page)).toContain('Issued')

    await as(page, 'client@demo.test')
    await page.getByTestId('nav-reports').click()
    await page.getByTestId('report-row-B').filter({ hasText: TITLE }).getByRole('link').click()
    await expect
      .poll(() => page.getByTestId('report-replaces').textContent())
      .toContain('replaces revision A')
    await page.getByTestId('nav-reports').click()
    const revisionA = page.getByTestId('report-row-A').filter({ hasText: TITLE })
    await expect.poll(() => revisionA.textContent()).toContain('Superseded by B')
    await screenshot(page, 'client-reading-room')
    await revisionA.getByRole('link').click()
    await expect.poll(() => page.getByTestId('report-superseded').count()).toBe(1)
    await screenshot(page, 'client-report-superseded')
    expect(unexpectedErrors(browser().errors, [])).toEqual([])
  })
})
