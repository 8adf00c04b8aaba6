import { execFileSync } from 'node:child_process'
import { existsSync } from 'node:fs'

export const CHROMIUM_PATH = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium'

/** Browser tests drive Debian's Chromium; install it when missing (as root), else say what to do. */
export function ensureChromium(): void {
  if (existsSync(CHROMIUM_PATH)) return
  if (process.getuid?.() !== 0) {
    throw new Error(
      'Chromium is missing: run `sudo apt-get install chromium` or set CHROMIUM_PATH.',
    )
  }
  console.log('Installing chromium from Debian packages (one time)…')
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' }
  execFileSync('apt-get', ['update'], { stdio: 'ignore', env })
  execFileSync('apt-get', ['install', '-y', '--no-install-recommends', 'chromium'], {
    stdio: 'ignore',
    env,
  })
}
