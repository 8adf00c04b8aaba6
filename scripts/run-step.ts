import { spawn } from 'node:child_process'

/** Runs one command with inherited output; resolves with its exit code. */
export function runStep(
  command: string,
  args: string[],
  env: NodeJS.ProcessEnv = process.env,
): Promise<number> {
  return new Promise((resolveCode, reject) => {
    const child = spawn(command, args, { stdio: 'inherit', env })
    child.once('error', reject)
    child.once('exit', (code, signal) => resolveCode(code ?? (signal ? 1 : 0)))
  })
}
