import type { Config } from '../config'
import { FailureWindow } from './failure-window'

/** Why an attempt is refused before its password or code is even checked. */
export type ThrottleVerdict = { refused: false; delayMs: number } | { refused: true }

/** The first failures for an account are free; each later one doubles the wait, up to the cap. */
const FREE_FAILURES = 3
const FIRST_DELAY_MS = 250

/**
 * Throttles for guessing passwords or codes, ASVS 2.2.1 without lock-out: an account from one
 * address and one address across accounts are refused with 429 after their limits; failures
 * for the account from anywhere only slow it down, so a stranger cannot lock its owner out.
 */
export class SignInThrottle {
  private readonly byAddress: FailureWindow
  private readonly byAccountAndAddress: FailureWindow
  private readonly byAccount: FailureWindow

  constructor(private readonly limits: Config['loginLimits']) {
    const windowMs = limits.windowMinutes * 60_000
    this.byAddress = new FailureWindow(windowMs)
    this.byAccountAndAddress = new FailureWindow(windowMs)
    this.byAccount = new FailureWindow(windowMs)
  }

  check(account: string, address: string): ThrottleVerdict {
    if (
      this.byAddress.count(address) >= this.limits.perAddress ||
      this.byAccountAndAddress.count(`${account}|${address}`) >= this.limits.perAccount
    ) {
      return { refused: true }
    }
    const beyond = this.byAccount.count(account) - FREE_FAILURES
    const delayMs =
      beyond < 0 ? 0 : Math.min(FIRST_DELAY_MS * 2 ** beyond, this.limits.delayMaxSeconds * 1000)
    return { refused: false, delayMs }
  }

  failed(account: string, address: string): void {
    this.byAddress.add(address)
    this.byAccountAndAddress.add(`${account}|${address}`)
    this.byAccount.add(account)
  }

  succeeded(account: string, address: string): void {
    this.byAccountAndAddress.clear(`${account}|${address}`)
  }
}

export const pause = (ms: number) =>
  new Promise<void>((done) => (ms > 0 ? setTimeout(done, ms) : done()))
