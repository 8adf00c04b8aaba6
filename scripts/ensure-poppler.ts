import { execFileSync } from 'node:child_process'
import { existsSync } from 'node:fs'

export const PDFTOPPM_PATH = '/usr/bin/pdftoppm'

/** The PDF tests turn pages into images with Debian's poppler-utils; install it when missing. */
export function ensurePoppler(): void {
  if (existsSync(PDFTOPPM_PATH)) return
  if (process.getuid?.() !== 0)
    throw new Error('pdftoppm is missing: run `sudo apt-get install poppler-utils`.')
  console.log('Installing poppler-utils from Debian packages (one time)…')
  const env = { ...process.env, DEBIAN_FRONTEND: 'noninteractive' }
  execFileSync('apt-get', ['update'], { stdio: 'ignore', env })
  execFileSync('apt-get', ['install', '-y', '--no-install-recommends', 'poppler-utils'], {
    stdio: 'ignore',
    env,
  })
}
