import { spawn } from 'node:child_process'
import { resolve } from 'node:path'
import { fileURLToPath } from 'node:url'
import { expect, it } from 'vitest'

const probe = resolve(fileURLToPath(import.meta.url), '../../helpers/guard-probe.ts')

function runProbe(): Promise<{ status: number | null; lines: string[] }> {
  return new Promise((done) => {
    const child = spawn(process.execPath, ['--import', 'tsx', probe], { timeout: 30_000 })
    let output = ''
    child.stdout.on('data', (chunk: Buffer) => (output += chunk.toString()))
    child.on('close', (status) => done({ status, lines: output.trim().split('\n') }))
  })
}

// One process of its own through tsx: seconds on a busy machine, so it runs with the API tests,
// one file at a time, rather than beside the parallel unit tests.
it('keeps serving after an outage’s stray errors, and shuts down on any other', async () => {
  const { status, lines } = await runProbe()
  const logged = lines.filter((line) => !line.startsWith(' '))
  expect(logged[0]).toMatch(/^Unhandled rejection while the database is unavailable/)
  expect(logged).toContainEqual(
    expect.stringMatching(/^Uncaught exception while the database is unavailable/),
  )
  const rest = logged.slice(logged.indexOf('still serving after both'))
  expect(rest[0]).toBe('still serving after both')
  expect(rest[1]).toMatch(/^Unhandled rejection; shutting down/)
  expect(rest).toContain('shutting down')
  expect(rest).not.toContain('still serving after the programming error')
  expect(status).toBe(3)
}, 30_000)
