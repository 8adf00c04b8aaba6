import { describe, expect, inject, it } from 'vitest'
import { focusIsWithin, seriousAccessibilityProblems, tabTo } from '../helpers/accessibility'
import { secondFactorCodeFor, signIn, useBrowser, waitForTable } from '../helpers/browser'

const browser = useBrowser()

/*
 * axe-core (WCAG 2.x A/AA and best practice) on every main screen each role reaches: no serious
 * or critical finding. Then sign-in, the case list and a case page used with the keyboard only.
 */

type Screen =
  | 'home'
  | 'cases'
  | 'case'
  | 'new case'
  | 'people'
  | 'organisations'
  | 'review'
  | 'case reports'
  | 'reading room'
  | 'report'
  | 'outbox'
  | 'mail sent'
  | 'laboratory'
  | 'security trail'
  | 'findings'
  | 'specifications'

const SCREENS_BY_ROLE: { email: string; screens: Screen[] }[] = [
  {
    email: 'admin@demo.test',
    screens: ['home', 'cases', 'case', 'new case', 'people'],
  },
  { email: 'admin@demo.test', screens: ['organisations', 'outbox', 'mail sent', 'laboratory'] },
  {
    email: 'investigator@demo.test',
    screens: ['home', 'cases', 'case', 'findings', 'new case', 'case reports'],
  },
  // a test of its own: many screens with axe each take too long for one test on a busy machine
  { email: 'admin@demo.test', screens: ['security trail'] },
  { email: 'admin@demo.test', screens: ['specifications'] },
  { email: 'lab@demo.test', screens: ['home', 'cases', 'case', 'specifications'] },
  { email: 'reviewer@demo.test', screens: ['home', 'cases', 'case', 'findings', 'review'] },
  { email: 'client@demo.test', screens: ['home', 'cases', 'case', 'reading room', 'report'] },
]

/** A section of the demo's issued case, with its review history and report. */
async function openIssuedCase(section: 'review' | 'reports'): Promise<void> {
  const page = browser().page
  await page.goto(`${inject('baseUrl')}/cases?q=${encodeURIComponent('slewing ring bolt')}`)
  await page.getByTestId('case-table').getByText('Fractured slewing ring bolt').click()
  await page.getByTestId('case-page').waitFor()
  await page.getByTestId(`section-case-${section}`).click()
  await page.getByTestId(`case-${section}`).waitFor()
}

async function openScreen(screen: Screen): Promise<void> {
  const page = browser().page
  const base = inject('baseUrl')
  const addresses: Record<
    Exclude<Screen, 'case' | 'findings' | 'review' | 'case reports' | 'report'>,
    string
  > = {
    home: '/',
    cases: '/cases',
    'new case': '/cases/new',
    people: '/admin/people',
    organisations: '/admin/organisations',
    outbox: '/admin/outbox',
    'mail sent': '/admin/mail',
    'reading room': '/reports',
    laboratory: '/admin/laboratory',
    'security trail': '/admin/security-events',
    specifications: '/specifications',
  }
  if (screen === 'review') await openIssuedCase('review')
  else if (screen === 'case reports') await openIssuedCase('reports')
  else if (screen === 'report') {
    await openScreen('reading room')
    await page.getByTestId('report-list').locator('tbody a').first().click()
    await page.getByTestId('report-reader').waitFor()
  } else if (screen === 'case') {
    await openScreen('cases')
    await page.getByTestId('case-table').locator('tbody a').first().click()
    await page.getByTestId('case-page').waitFor()
  } else if (screen === 'findings') {
    // a drafting demo case with figures and opinions: the editor for its lead, the read view else
    await page.goto(`${base}/cases?q=${encodeURIComponent('pump shaft')}`)
    await page.getByTestId('case-table').getByText('Transfer pump shaft fracture').click()
    await page.getByTestId('section-case-findings').click()
    await page
      .locator('[data-testid="findings-text"], [data-testid="findings-html"]')
      .first()
      .waitFor()
  } else {
    await page.goto(`${base}${addresses[screen]}`)
    await page.locator('main h1').first().waitFor()
  }
  await waitForTable(page)
}

async function signOut(): Promise<void> {
  await browser().context.clearCookies()
}

describe('accessibility', () => {
  it('finds no serious problem on the screens a signed-out visitor sees', async () => {
    const page = browser().page
    await page.goto(`${inject('baseUrl')}/sign-in`)
    await page.getByTestId('sign-in-form').waitFor()
    expect(await seriousAccessibilityProblems(page), 'sign-in').toEqual([])
    await page.goto(`${inject('baseUrl')}/no/such/page`)
    await page.getByTestId('not-found').waitFor()
    expect(await seriousAccessibilityProblems(page), 'not found').toEqual([])
  })

  for (const { email, screens } of SCREENS_BY_ROLE) {
    it(`finds no serious problem on the main screens of ${email}: ${screens.join(', ')}`, async () => {
      const page = browser().page
      await signIn(page, inject('baseUrl'), email, inject('demoPassword'))
      const problems: string[] = []
      for (const screen of screens) {
        await openScreen(screen)
        problems.push(
          ...(await seriousAccessibilityProblems(page)).map((line) => `${screen}: ${line}`),
        )
      }
      await signOut()
      expect(problems).toEqual([])
    })
  }
})

describe('with the keyboard only', () => {
  it('one signs in, finds an intake case in the list, opens it and reaches its status control', async () => {
    const page = browser().page
    const base = inject('baseUrl')
    await page.goto(`${base}/sign-in?redirect=%2Fcases`)
    await page.getByTestId('sign-in-form').waitFor()
    await tabTo(page, '#email')
    await page.keyboard.type('admin@demo.test')
    await page.keyboard.press('Tab')
    await tabTo(page, '#password', 1)
    await page.keyboard.type(inject('demoPassword'))
    await page.keyboard.press('Enter')
    // the second step takes the focus to its code field
    await expect.poll(() => focusIsWithin(page, '#second-factor-code')).toBe(true)
    await page.keyboard.type(await secondFactorCodeFor('admin@demo.test'))
    await page.keyboard.press('Enter')
    await page.waitForURL(`${base}/cases`)
    await waitForTable(page)

    // the browser's own drop-down chooses by typing while it has focus
    await tabTo(page, '[data-testid="status-filter"]')
    await page.keyboard.type('Intake')
    await page.waitForURL(/status=intake/)
    await waitForTable(page)
    await tabTo(page, '[data-testid="case-table"] tbody a')
    const number = await page.evaluate(() => document.activeElement?.textContent?.trim())
    await page.keyboard.press('Enter')
    await page.getByTestId('case-page').waitFor()
    expect(await page.getByTestId('case-number').textContent()).toBe(number)
    expect(await page.getByTestId('case-status').textContent()).toBe('Intake')

    await tabTo(page, '[data-testid^="move-to-"]')
    await page.keyboard.press('Enter')
    await expect.poll(() => page.getByRole('alertdialog').count()).toBe(1)
    await expect.poll(() => focusIsWithin(page, '[role="alertdialog"]')).toBe(true)
    await page.keyboard.press('Escape')
    await expect.poll(() => page.getByRole('alertdialog').count()).toBe(0)
    expect(await page.getByTestId('case-status').textContent()).toBe('Intake')
    await signOut()
  })
})
