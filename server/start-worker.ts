import { createRequire } from 'node:module'
import { pathToFileURL } from 'node:url'
import { Worker } from 'node:worker_threads'

export interface WorkerFiles {
  /** the worker's TypeScript file, relative to the caller's module */
  source: string
  /** the compiled worker's file name beside the server bundle in dist-server/ */
  compiled: string
}

/**
 * Starts a worker thread from the caller's module (`callerUrl`: its `import.meta.url`). Compiled,
 * every module's URL is the bundle's, so the worker is the `.js` file beside it; from source (tsx,
 * vitest) it is the TypeScript file, run through tsx's loader registered inside the worker
 * (Node 20 does not pass an --import loader on to worker threads).
 */
export function startWorker(callerUrl: string, files: WorkerFiles): Worker {
  if (!callerUrl.endsWith('.ts')) return new Worker(new URL(`./${files.compiled}`, callerUrl))
  const workerFile = new URL(files.source, callerUrl).href
  // require.resolve finds the CommonJS build of tsx's ESM API; the worker imports its ESM twin.
  const tsxApi = pathToFileURL(
    createRequire(callerUrl)
      .resolve('tsx/esm/api')
      .replace(/\.cjs$/, '.mjs'),
  ).href
  const boot = `import(${JSON.stringify(tsxApi)}).then(({ register }) => { register(); return import(${JSON.stringify(workerFile)}) })`
  return new Worker(boot, { eval: true })
}
