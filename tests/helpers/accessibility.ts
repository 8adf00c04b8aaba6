import { readFileSync } from 'node:fs'
import { createRequire } from 'node:module'
import type { AxeResults } from 'axe-core'
import type { Page } from 'playwright-core'

const axeSource = readFileSync(
  createRequire(import.meta.url).resolve('axe-core/axe.min.js'),
  'utf8',
)

/** WCAG 2.x A and AA rules, and axe's own best practices. */
const RULE_TAGS = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22aa', 'best-practice']

/**
 * Runs axe-core in the page as it stands and returns its serious and critical findings, one line
 * each with the elements concerned. The script is evaluated through the browser's debugging
 * channel, which the page's content security policy does not govern.
 */
export async function seriousAccessibilityProblems(page: Page): Promise<string[]> {
  const loaded = await page.evaluate(() => 'axe' in window)
  if (!loaded) await page.evaluate(axeSource)
  const results = (await page.evaluate(
    (tags) =>
      (window as unknown as { axe: { run: (...args: unknown[]) => Promise<unknown> } }).axe.run(
        document,
        { runOnly: { type: 'tag', values: tags }, resultTypes: ['violations'] },
      ),
    RULE_TAGS,
  )) as AxeResults
  return results.violations
    .filter(({ impact }) => impact === 'serious' || impact === 'critical')
    .map(({ id, impact, help, nodes }) => {
      const where = nodes.map((node) => node.target.join(' ')).join(', ')
      return `${impact} ${id}: ${help} (${where})`
    })
}

/** Presses Tab until the focused element matches the selector, as a keyboard user moves on. */
export async function tabTo(page: Page, selector: string, limit = 40): Promise<void> {
  for (let presses = 0; presses < limit; presses++) {
    const there = await page.evaluate(
      (wanted) => !!document.activeElement?.matches(wanted),
      selector,
    )
    if (there) return
    await page.keyboard.press('Tab')
  }
  throw new Error(`${selector} is not reached with ${limit} presses of Tab`)
}

/** Whether the focused element lies inside an element matching the selector. */
export function focusIsWithin(page: Page, selector: string): Promise<boolean> {
  return page.evaluate((wanted) => !!document.activeElement?.closest(wanted), selector)
}
