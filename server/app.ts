import { existsSync } from 'node:fs'
import { resolve } from 'node:path'
import { fileURLToPath } from 'node:url'
import express, { type Express } from 'express'
import helmet from 'helmet'
import morgan from 'morgan'
import type { Config } from './config'
import type { Db } from './db/knex'
import { apiNotFound, errorHandler } from './middleware/error-handler'
import { healthRoutes } from './routes/health'

export interface AppDeps {
  db: Db
  config: Config
  /** folder of the built client; served when present */
  clientDir?: string
  log?: (error: unknown) => void
}

const defaultClientDir = resolve(fileURLToPath(import.meta.url), '../../dist')

function securityHeaders(config: Config) {
  return helmet({
    contentSecurityPolicy: {
      useDefaults: false,
      directives: {
        defaultSrc: ["'self'"],
        scriptSrc: ["'self'"],
        // PrimeVue's styled mode injects its theme as <style> elements at run time.
        styleSrc: ["'self'", "'unsafe-inline'"],
        imgSrc: ["'self'", 'data:', 'blob:'],
        fontSrc: ["'self'"],
        connectSrc: ["'self'"],
        objectSrc: ["'none'"],
        baseUri: ["'self'"],
        formAction: ["'self'"],
        frameAncestors: ["'none'"],
        ...(config.nodeEnv === 'production' ? { upgradeInsecureRequests: [] } : {}),
      },
    },
    strictTransportSecurity: config.nodeEnv === 'production',
  })
}

function serveClient(app: Express, clientDir: string): void {
  if (!existsSync(resolve(clientDir, 'index.html'))) return
  app.use(express.static(clientDir, { index: false, maxAge: '1h' }))
  app.get('/{*path}', (_req, res) => {
    res.sendFile(resolve(clientDir, 'index.html'), { maxAge: 0 })
  })
}

/** Builds the whole HTTP application without listening, so tests can drive it with supertest. */
export function createApp(deps: AppDeps): Express {
  const { db, config } = deps
  const log = deps.log ?? ((error: unknown) => console.error(error))
  const app = express()
  app.disable('x-powered-by')
  app.set('trust proxy', 'loopback')
  app.use(securityHeaders(config))
  if (config.logRequests) app.use(morgan('short'))

  const api = express.Router()
  api.use(express.json({ limit: '100kb' }))
  api.use('/health', healthRoutes(db))
  api.use(apiNotFound)
  api.use(errorHandler(log))
  app.use('/api', api)

  serveClient(app, deps.clientDir ?? defaultClientDir)
  app.use(errorHandler(log))
  return app
}
