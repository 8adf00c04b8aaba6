import { spawnSync } from 'node:child_process'
import path from 'node:path'

export const REPO_ROOT = path.resolve(import.meta.dirname, '../../..')

/**
 * A generous bound for a test that starts the command line (about a second each, several
 * seconds on a machine busy with other test runs): it catches a hang, it times nothing.
 */
export const CLI_TEST_TIMEOUT_MS = 60_000

export interface CliRun {
  status: number | null
  stdout: string
  stderr: string
}

/** Runs the command-line entry as lab staff would, in a child process. */
export function runAnalyze(args: readonly string[]): CliRun {
  const result = spawnSync(
    process.execPath,
    ['--import', 'tsx', 'server/cli/analyze.ts', ...args],
    {
      cwd: REPO_ROOT,
      encoding: 'utf8',
      timeout: 60_000,
    },
  )
  return { status: result.status, stdout: result.stdout, stderr: result.stderr }
}
