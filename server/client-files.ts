import { existsSync } from 'node:fs'
import type { ServerResponse } from 'node:http'
import { resolve, sep } from 'node:path'
import type { Express } from 'express'
import expressStaticGzip from 'express-static-gzip'

/** Hashed file names change whenever their content does, so browsers may keep them for good. */
export const HASHED_FILE_CACHING = 'public, max-age=31536000, immutable'
/** Everything else (index.html, the icon) is checked with the server on every use. */
export const REVALIDATED_FILE_CACHING = 'no-cache'

/**
 * Serves the built client: the brotli or gzip copy made at build time when the browser accepts
 * it (negotiated per request, with `Vary: Accept-Encoding`), long caching for hashed assets, and
 * index.html for every other address so the client's router can show it.
 */
export function serveClient(app: Express, clientDir: string): void {
  if (!existsSync(resolve(clientDir, 'index.html'))) return
  const hashedDir = resolve(clientDir, 'assets') + sep
  const files = expressStaticGzip(clientDir, {
    enableBrotli: true,
    orderPreference: ['br', 'gzip'],
    index: false,
    serveStatic: {
      index: false,
      cacheControl: false,
      setHeaders: (res: ServerResponse, path: string) => {
        const hashed = path.startsWith(hashedDir)
        res.setHeader('Cache-Control', hashed ? HASHED_FILE_CACHING : REVALIDATED_FILE_CACHING)
      },
    },
  })
  app.use(files)
  // A missing hashed file is asked for by a page from an older build: say so, not index.html.
  app.use('/assets', (_req, res) => {
    res.status(404).type('text/plain').send('Not found')
  })
  app.get('/{*path}', (req, res, next) => {
    req.url = '/index.html'
    files(req, res, next)
  })
}
