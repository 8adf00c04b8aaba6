import { resolve, sep } from 'node:path'
import compression from 'compression'
import express, { type Express } from 'express'
import helmet from 'helmet'
import morgan from 'morgan'
import type { Config } from './config'
import type { Db } from './db/knex'
import { csrfProtection } from './auth/csrf'
import { createPassport } from './auth/passport'
import { createSessionMiddleware, enforceAbsoluteLifetime } from './auth/session'
import { serveClient } from './client-files'
import { apiNotFound, errorHandler } from './middleware/error-handler'
import {
  requirePasswordSet,
  requireSecondFactorSet,
  requireSignedIn,
} from './middleware/require-auth'
import { securityEventRoutes } from './routes/security-events'
import { createSecondFactorService } from './services/second-factor'
import { recordSecurityEvent, securityContextOf } from './services/security-events'
import type { AppError } from './errors'
import type { Request } from 'express'
import { authRoutes } from './routes/auth'
import { caseRoutes } from './routes/cases'
import { dashboardRoutes } from './routes/dashboard'
import { healthRoutes } from './routes/health'
import { organisationRoutes } from './routes/organisations'
import { projectRoot } from './project-root'
import { peopleRoutes, staffRoutes } from './routes/people'
import { createCaseService } from './services/cases'
import { createOrganisationService } from './services/organisations'
import { createPeopleService } from './services/people'
import { createEvidenceServices } from './services/evidence'
import { createServiceEventService } from './services/service-events'
import { attachmentRoutes } from './routes/service-events'
import { casePhotoRoutes, photoRoutes } from './routes/photos'
import { createPhotoService } from './services/photos/photos'
import { incomingDirOf } from './middleware/upload'
import { specificationRoutes } from './routes/specifications'
import { adminMailRoutes } from './routes/admin-mail'
import { analyseInThread, type TensileAnalyser } from './tensile/analyse-upload'
import type { FileStorage } from './storage/file-storage'
import { createLocalStorage } from './storage/local-storage'
import { findingsBodyParser, findingsRoutes } from './routes/findings'
import { createFindingsService } from './services/findings'
import { hardnessRoutes } from './routes/hardness'
import { reviewRoutes } from './routes/review'
import { amendRoutes, caseReportListRoutes, issueRoutes, reportRoutes } from './routes/reports'
import { createReviewService } from './services/review'
import { createReportService } from './services/reports'
import { settingsRoutes } from './routes/settings'
import type { PdfRenderer } from './routes/report-pdf'
import { renderReportPdfOffThread } from './services/reports/pdf'

export interface AppDeps {
  db: Db
  config: Config
  /** where uploaded files go; by default the local folder UPLOADS_DIR */
  storage?: FileStorage
  /** where uploads wait while they are checked; by default UPLOADS_DIR/incoming */
  incomingDir?: string
  /** folder of the built client; served when present */
  clientDir?: string
  log?: (error: unknown) => void
  /** runs tensile analyses; by default in the request's thread (the server passes a pool) */
  analyseTensile?: TensileAnalyser
  /** lays out report PDFs; by default in a worker thread of its own per report */
  renderReportPdf?: PdfRenderer
}

const defaultClientDir = resolve(projectRoot(), 'dist')

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
        baseUri: ["'none'"],
        formAction: ["'self'"],
        frameAncestors: ["'none'"],
        ...(config.nodeEnv === 'production' ? { upgradeInsecureRequests: [] } : {}),
      },
    },
    strictTransportSecurity: config.nodeEnv === 'production',
  })
}

function apiRouter(deps: AppDeps & { storage: FileStorage }, log: (error: unknown) => void) {
  const { db, config } = deps
  const people = createPeopleService(db, {
    passwordCost: config.passwordCost,
    oneTimePasswordHours: config.oneTimePasswordHours,
  })
  const secondFactors = createSecondFactorService(db)
  const passport = createPassport(people)
  const api = express.Router()
  // answers carry one-time passwords and case data; file routes that never change say otherwise
  api.use((_req, res, next) => {
    res.setHeader('Cache-Control', 'no-store')
    next()
  })
  // The built client is compressed ahead of time; answers of the API are compressed here.
  api.use(compression())
  // not strict: a `null` or a bare number is refused by validate() with words saying what to send
  api.put('/cases/:id/findings', findingsBodyParser)
  api.use(express.json({ limit: '100kb', strict: false }))
  api.use(createSessionMiddleware(db, config).middleware)
  api.use(enforceAbsoluteLifetime(config))
  api.use(passport.session())
  api.use(csrfProtection)
  api.use('/health', healthRoutes(db))
  api.use('/auth', authRoutes({ db, passport, people, secondFactors, config }))
  const signedIn = [requireSignedIn, requirePasswordSet, requireSecondFactorSet]
  api.use('/people', ...signedIn, peopleRoutes(people, secondFactors))
  api.use('/security-events', ...signedIn, securityEventRoutes(db))
  api.use('/staff', ...signedIn, staffRoutes(people))
  api.use('/organisations', ...signedIn, organisationRoutes(createOrganisationService(db)))
  const cases = createCaseService()
  const serviceEvents = createServiceEventService({ storage: deps.storage })
  const evidence = createEvidenceServices()
  const photos = createPhotoService({ storage: deps.storage })
  const incomingDir = deps.incomingDir ?? incomingDirOf(config.uploadsDir)
  const renderPdf = deps.renderReportPdf ?? renderReportPdfOffThread
  const reports = createReportService({ storage: deps.storage, photos, renderPdf })
  const children = {
    photos: casePhotoRoutes(db, photos, incomingDir),
    findings: findingsRoutes(db, createFindingsService(), {
      photos,
      render: renderPdf,
    }),
    hardness: hardnessRoutes(db),
    review: reviewRoutes(db, createReviewService()),
    reports: caseReportListRoutes(db, reports),
    issue: issueRoutes(db, reports),
    amend: amendRoutes(db, reports),
  }
  const tests = {
    storage: deps.storage,
    analyse: deps.analyseTensile ?? analyseInThread,
    incomingDir,
  }
  api.use('/cases', ...signedIn, caseRoutes(db, cases, serviceEvents, evidence, tests, children))
  api.use('/specifications', ...signedIn, specificationRoutes(db))
  api.use('/attachments', ...signedIn, attachmentRoutes(db, cases, serviceEvents))
  api.use('/photos', ...signedIn, photoRoutes(db, cases, photos))
  api.use('/reports', ...signedIn, reportRoutes(db, cases, reports))
  api.use('/dashboard', ...signedIn, dashboardRoutes(db))
  api.use('/admin', ...signedIn, adminMailRoutes(db, { demo: config.demoData }))
  api.use('/settings', ...signedIn, settingsRoutes(db))
  api.use(apiNotFound)
  api.use(errorHandler(log, refusalRecorder(db)))
  return api
}

function refusalRecorder(db: Db) {
  return async (req: Request, refusal: AppError) => {
    const kind = refusal.code === 'csrf_invalid' ? 'csrf.refused' : 'access.refused'
    const caseId = 'caseId' in refusal ? refusal.caseId : undefined
    const details = {
      method: req.method,
      path: req.originalUrl.split('?')[0],
      status: refusal.status,
      caseId,
    }
    await recordSecurityEvent(db, securityContextOf(req), { kind, details })
  }
}

/** Uploads are served only through the API's checks: never from a folder the web server serves. */
function checkUploadsFolder(uploadsDir: string, clientDir: string): void {
  const uploads = resolve(uploadsDir)
  const inside = (folder: string) => uploads === folder || uploads.startsWith(`${folder}${sep}`)
  if (inside(resolve(clientDir)) || inside(resolve(clientDir, '../public'))) {
    throw new Error(`UPLOADS_DIR (${uploads}) must not be inside a publicly served folder`)
  }
}

/** Builds the whole HTTP application without listening, so tests can drive it with supertest. */
export function createApp(deps: AppDeps): Express {
  const { config } = deps
  const clientDir = deps.clientDir ?? defaultClientDir
  checkUploadsFolder(config.uploadsDir, clientDir)
  const storage = deps.storage ?? createLocalStorage(config.uploadsDir)
  const log = deps.log ?? ((error: unknown) => console.error(error))
  const app = express()
  app.disable('x-powered-by')
  // X-Forwarded-For names the client only when a trusted proxy sent the request (TRUST_PROXY)
  app.set('trust proxy', config.trustProxy)
  app.use(securityHeaders(config))
  if (config.logRequests) app.use(morgan('short'))

  app.use('/api', apiRouter({ ...deps, storage }, log))

  serveClient(app, clientDir)
  app.use(errorHandler(log))
  return app
}
