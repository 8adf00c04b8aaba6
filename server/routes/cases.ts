import { Router } from 'express'
import { CaseCreate, CaseListQuery, CaseStatusChange } from '../../shared/schemas/cases'
import { IdParams } from '../../shared/schemas/common'
import { nextStates } from '../../shared/workflow/case-states'
import { can, organisationScope } from '../auth/policy'
import { authorize, currentUser, requirePermission } from '../middleware/require-auth'
import { validate } from '../middleware/validate'
import type { CaseService } from '../services/cases'
import type { CaseDetail } from '../../shared/schemas/cases'

/** The case plus the plain status changes this person may make now. */
function withNextStates(user: Express.User, detail: CaseDetail) {
  const allowed = can(user, 'case.changeStatus', detail)
    ? nextStates(detail.status, user.roles)
    : []
  return { ...detail, allowedNextStates: allowed }
}

export function caseRoutes(cases: CaseService): Router {
  const router = Router()
  router.get('/', validate('query', CaseListQuery), async (req, res) => {
    const user = authorize(req, 'cases.list')
    res.json(await cases.list(res.locals.query as CaseListQuery, organisationScope(user)))
  })
  router.post(
    '/',
    requirePermission('case.create'),
    validate('body', CaseCreate),
    async (req, res) => {
      const user = currentUser(req)
      const created = await cases.create(res.locals.body as CaseCreate, user.id)
      res.status(201).json({ data: withNextStates(user, created) })
    },
  )
  router.get('/:id', validate('params', IdParams), async (req, res) => {
    const user = authorize(req, 'cases.list')
    const { id } = res.locals.params as IdParams
    const detail = await cases.get(id, organisationScope(user))
    authorize(req, 'case.view', detail)
    res.json({ data: withNextStates(user, detail) })
  })
  router.post(
    '/:id/status',
    requirePermission('case.changeStatus'),
    validate('params', IdParams),
    validate('body', CaseStatusChange),
    async (req, res) => {
      const user = currentUser(req)
      const { id } = res.locals.params as IdParams
      const detail = await cases.get(id, organisationScope(user))
      authorize(req, 'case.changeStatus', detail)
      const { status } = res.locals.body as CaseStatusChange
      res.json({ data: withNextStates(user, await cases.changeStatus(id, status, user)) })
    },
  )
  return router
}
