import request from 'supertest'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createApp } from '../../server/app'
import { renderReportPdf } from '../../server/services/reports/pdf'
import type { Role } from '../../shared/schemas/roles'
import { makeCase, makeOrganisation, makePerson } from '../factories'
import { signedIn, type ApiSession } from '../helpers/api-session'
import { testConfig } from '../helpers/test-config'
import { createTestDb, resetDatabase } from '../helpers/test-db'

const db = createTestDb()
// PDFs laid out in the request's thread: quicker here than a worker per request
const app = createApp({
  db,
  config: testConfig(),
  clientDir: '/nonexistent',
  renderReportPdf,
})
const ROLES: Role[] = ['admin', 'investigator', 'lab', 'reviewer', 'client']
const sessions = new Map<Role, ApiSession>()
const ids = { ownCase: 0, otherCase: 0, person: 0, organisation: 0 }

beforeAll(async () => {
  await resetDatabase(db)
  const own = await makeOrganisation(db)
  const other = await makeOrganisation(db)
  for (const role of ROLES) {
    const person = await makePerson(db, [role], role === 'client' ? { organisationId: own } : {})
    sessions.set(role, await signedIn(app, person.email, person.password))
  }
  const author = await makePerson(db, ['investigator'])
  ids.ownCase = (await makeCase(db, own, author.id)).id
  ids.otherCase = (await makeCase(db, other, author.id)).id
  ids.person = author.id
  ids.organisation = other
})
afterAll(() => db.destroy())

interface RouteCase {
  method: 'get' | 'post' | 'put' | 'patch' | 'delete'
  /** path with :ownCase, :otherCase, :person or :organisation standing for the ids made above */
  template: string
  body?: object
  /** expected status per role; a role left out expects the `others` status */
  expect: Partial<Record<Role, number>> & { others: number }
}

// Bodies are deliberately invalid where the route writes: a 400 proves the request got past
// the access check without changing anything, a 403/404 that it did not.
const ROUTES: RouteCase[] = [
  { method: 'get', template: '/api/people', expect: { admin: 200, others: 403 } },
  { method: 'post', template: '/api/people', body: {}, expect: { admin: 400, others: 403 } },
  { method: 'put', template: '/api/people/:person', body: {}, expect: { admin: 400, others: 403 } },
  { method: 'get', template: '/api/staff', expect: { client: 403, others: 200 } },
  { method: 'get', template: '/api/organisations', expect: { others: 200 } },
  { method: 'post', template: '/api/organisations', body: {}, expect: { admin: 400, others: 403 } },
  {
    method: 'put',
    template: '/api/organisations/:organisation',
    body: {},
    expect: { admin: 400, others: 403 },
  },
  { method: 'get', template: '/api/cases', expect: { others: 200 } },
  {
    method: 'post',
    template: '/api/cases',
    body: {},
    expect: { admin: 400, investigator: 400, others: 403 },
  },
  { method: 'get', template: '/api/cases/:ownCase', expect: { others: 200 } },
  // hardness readings are the lab's working results: staff read them, clients never
  { method: 'get', template: '/api/cases/:ownCase/hardness', expect: { client: 404, others: 200 } },
  {
    method: 'post',
    template: '/api/cases/:ownCase/hardness',
    body: {},
    expect: { admin: 400, client: 404, others: 403 },
  },
  // drafts are for staff; a client learns nothing of them, not even that one exists
  { method: 'get', template: '/api/cases/:ownCase/findings', expect: { client: 404, others: 200 } },
  // the draft's PDF preview: for those who may read the draft
  {
    method: 'get',
    template: '/api/cases/:ownCase/findings/pdf',
    expect: { client: 404, others: 200 },
  },
  // the laboratory's particulars: staff read them, administrators change them
  { method: 'get', template: '/api/settings/laboratory', expect: { client: 403, others: 200 } },
  {
    method: 'put',
    template: '/api/settings/laboratory',
    body: {},
    expect: { admin: 400, others: 403 },
  },
  // each person's own e-mail notices: everyone reads and sets their own
  { method: 'get', template: '/api/settings/notices', expect: { others: 200 } },
  { method: 'put', template: '/api/settings/notices', body: {}, expect: { others: 400 } },
  // only the case's own investigators write them: these cases have none yet
  {
    method: 'put',
    template: '/api/cases/:ownCase/findings',
    body: {},
    expect: { client: 404, others: 403 },
  },

  { method: 'get', template: '/api/cases/:otherCase', expect: { client: 404, others: 200 } },
  {
    method: 'post',
    template: '/api/cases/:ownCase/status',
    body: {},
    expect: { admin: 400, investigator: 400, others: 403 },
  },
  {
    method: 'post',
    template: '/api/cases/:otherCase/status',
    body: {},
    expect: { admin: 400, investigator: 400, client: 404, others: 403 },
  },
  // the cases have no lead yet, so any investigator may take them on
  {
    method: 'patch',
    template: '/api/cases/:ownCase',
    body: {},
    expect: { admin: 400, investigator: 400, others: 403 },
  },
  {
    method: 'patch',
    template: '/api/cases/:otherCase',
    body: {},
    expect: { admin: 400, investigator: 400, client: 404, others: 403 },
  },
  { method: 'get', template: '/api/cases/:ownCase/activity', expect: { client: 403, others: 200 } },
  {
    method: 'get',
    template: '/api/cases/:otherCase/activity',
    expect: { client: 404, others: 200 },
  },
  { method: 'get', template: '/api/cases/:ownCase/service-events', expect: { others: 200 } },
  {
    method: 'get',
    template: '/api/cases/:otherCase/service-events',
    expect: { client: 404, others: 200 },
  },
  {
    method: 'post',
    template: '/api/cases/:ownCase/service-events',
    body: {},
    expect: { admin: 400, investigator: 400, others: 403 },
  },
  {
    method: 'patch',
    template: '/api/cases/:ownCase/service-events/999999',
    body: {},
    expect: { admin: 400, investigator: 400, others: 403 },
  },
  {
    method: 'delete',
    template: '/api/cases/:otherCase/service-events/999999',
    body: {},
    expect: { admin: 400, investigator: 400, client: 404, others: 403 },
  },
  {
    method: 'post',
    template: '/api/cases/:ownCase/service-events/999999/attachments',
    expect: { admin: 400, investigator: 400, others: 403 },
  },
  { method: 'get', template: '/api/attachments/999999', expect: { others: 404 } },
  // evidence: reads by the case loader (clients see their items marked for them, nothing else)
  { method: 'get', template: '/api/cases/:ownCase/samples', expect: { others: 200 } },
  {
    method: 'get',
    template: '/api/cases/:otherCase/samples',
    expect: { client: 404, others: 200 },
  },
  { method: 'get', template: '/api/cases/:ownCase/samples/999999', expect: { others: 404 } },
  {
    method: 'post',
    template: '/api/cases/:ownCase/samples',
    body: {},
    expect: { admin: 400, investigator: 400, others: 403 },
  },
  {
    method: 'post',
    template: '/api/cases/:otherCase/samples/999999/custody-events',
    body: {},
    expect: { admin: 400, investigator: 400, client: 404, others: 403 },
  },
  { method: 'get', template: '/api/cases/:ownCase/notices', expect: { client: 403, others: 200 } },
  {
    method: 'post',
    template: '/api/cases/:ownCase/notices',
    body: {},
    expect: { admin: 400, investigator: 400, others: 403 },
  },
  {
    method: 'post',
    template: '/api/cases/:ownCase/notices/999999/answers',
    body: {},
    expect: { admin: 400, investigator: 400, others: 403 },
  },
  {
    method: 'post',
    template: '/api/cases/:ownCase/notices/999999/answers/999999/resolution',
    body: {},
    expect: { admin: 400, others: 403 },
  },
  {
    method: 'get',
    template: '/api/cases/:ownCase/notice-period',
    expect: { client: 403, others: 200 },
  },
  {
    method: 'put',
    template: '/api/cases/:ownCase/notice-period',
    body: {},
    expect: { admin: 400, investigator: 400, others: 403 },
  },
  { method: 'get', template: '/api/cases/:ownCase/holds', expect: { client: 403, others: 200 } },
  {
    method: 'post',
    template: '/api/cases/:ownCase/holds',
    body: {},
    expect: { admin: 400, investigator: 400, others: 403 },
  },
  {
    method: 'post',
    template: '/api/cases/:otherCase/holds/999999/release',
    body: {},
    expect: { admin: 400, client: 404, others: 403 },
  },
  {
    method: 'get',
    template: '/api/cases/:ownCase/observations',
    expect: { client: 403, others: 200 },
  },
  {
    method: 'post',
    template: '/api/cases/:ownCase/observations',
    body: {},
    expect: { admin: 400, investigator: 400, others: 403 },
  },
  {
    method: 'post',
    template: '/api/cases/:ownCase/observations/999999/withdraw',
    body: {},
    expect: { admin: 400, investigator: 400, others: 403 },
  },
  { method: 'get', template: '/api/dashboard', expect: { others: 200 } },
  { method: 'get', template: '/api/cases/:ownCase/photos', expect: { others: 200 } },
  {
    method: 'get',
    template: '/api/cases/:otherCase/photos',
    expect: { client: 404, others: 200 },
  },
  // no file sent: 400 once past the access check (unled case: any investigator may add photos)
  {
    method: 'post',
    template: '/api/cases/:ownCase/photos',
    expect: { admin: 400, investigator: 400, others: 403 },
  },
  {
    method: 'post',
    template: '/api/cases/:otherCase/photos',
    expect: { admin: 400, investigator: 400, client: 404, others: 403 },
  },
  { method: 'get', template: '/api/photos/999999', expect: { others: 404 } },
  { method: 'patch', template: '/api/photos/999999', body: {}, expect: { others: 404 } },
  { method: 'get', template: '/api/photos/999999/original', expect: { others: 404 } },
  { method: 'get', template: '/api/photos/999999/display', expect: { others: 404 } },
  { method: 'get', template: '/api/photos/999999/thumbnail', expect: { others: 404 } },
  { method: 'get', template: '/api/photos/999999/figure', expect: { others: 404 } },
  { method: 'get', template: '/api/specifications', expect: { client: 403, others: 200 } },
  {
    method: 'post',
    template: '/api/specifications',
    body: {},
    expect: { admin: 400, others: 403 },
  },
  {
    method: 'patch',
    template: '/api/specifications/999999',
    body: {},
    expect: { admin: 400, others: 403 },
  },
  // this app is not in demo mode: the local mailbox is not there even for administrators
  { method: 'get', template: '/api/admin/mail', expect: { admin: 404, others: 403 } },
  { method: 'get', template: '/api/admin/outbox', expect: { admin: 200, others: 403 } },
  {
    method: 'post',
    template: '/api/admin/outbox/999999/resend',
    expect: { admin: 404, others: 403 },
  },
  { method: 'get', template: '/api/cases/:ownCase/specimens', expect: { others: 200 } },
  {
    method: 'get',
    template: '/api/cases/:otherCase/specimens',
    expect: { client: 404, others: 200 },
  },
  // the cases have no lead and no lab technician: only administrators record and confirm tests
  {
    method: 'post',
    template: '/api/cases/:ownCase/specimens',
    body: {},
    expect: { admin: 400, others: 403 },
  },
  {
    method: 'post',
    template: '/api/cases/:otherCase/specimens',
    body: {},
    expect: { admin: 400, client: 404, others: 403 },
  },
  {
    method: 'post',
    template: '/api/cases/:ownCase/specimens/999999/tensile-records',
    expect: { admin: 400, others: 403 },
  },
  {
    method: 'post',
    template: '/api/cases/:ownCase/tensile-records/999999/recompute',
    body: {},
    expect: { admin: 400, others: 403 },
  },
  {
    method: 'post',
    template: '/api/cases/:ownCase/tensile-records/999999/invalidate',
    body: {},
    expect: { admin: 400, others: 403 },
  },
  {
    method: 'post',
    template: '/api/cases/:ownCase/tensile-records/999999/confirm',
    body: {},
    expect: { admin: 400, others: 403 },
  },
  {
    method: 'get',
    template: '/api/cases/:ownCase/tensile-records/999999/file',
    expect: { client: 403, others: 404 },
  },
  // review: staff only (a client learns nothing of it); these cases have no lead and no reviewer,
  // so only an administrator gets as far as the state check (409: a case in intake)
  { method: 'get', template: '/api/cases/:ownCase/review', expect: { client: 404, others: 200 } },
  {
    method: 'post',
    template: '/api/cases/:ownCase/review/submit',
    expect: { admin: 409, client: 404, others: 403 },
  },
  {
    method: 'post',
    template: '/api/cases/:ownCase/review/request-revisions',
    body: {},
    expect: { client: 404, others: 403 },
  },
  {
    method: 'post',
    template: '/api/cases/:ownCase/review/approve',
    expect: { client: 404, others: 403 },
  },
  {
    method: 'get',
    template: '/api/cases/:ownCase/review/comments',
    expect: { client: 404, others: 200 },
  },
  {
    method: 'post',
    template: '/api/cases/:ownCase/review/comments',
    body: {},
    expect: { client: 404, others: 403 },
  },
  {
    method: 'post',
    template: '/api/cases/:ownCase/review/comments/999999/resolve',
    expect: { client: 404, others: 403 },
  },
  // issued reports: every staff member and the case's own client read them
  { method: 'get', template: '/api/cases/:ownCase/reports', expect: { others: 200 } },
  {
    method: 'get',
    template: '/api/cases/:otherCase/reports',
    expect: { client: 404, others: 200 },
  },
  {
    method: 'post',
    template: '/api/cases/:ownCase/issue',
    expect: { admin: 409, others: 403 },
  },
  {
    method: 'post',
    template: '/api/cases/:otherCase/issue',
    expect: { admin: 409, client: 404, others: 403 },
  },
  {
    method: 'post',
    template: '/api/cases/:ownCase/amend',
    body: {},
    expect: { admin: 400, others: 403 },
  },
  // the reading room's list: a client gets their organisation's revisions (none here)
  { method: 'get', template: '/api/reports', expect: { others: 200 } },
  { method: 'get', template: '/api/reports/999999', expect: { others: 404 } },
  { method: 'get', template: '/api/reports/999999/figures/f1', expect: { others: 404 } },
  { method: 'post', template: '/api/reports/999999/acknowledge', expect: { others: 404 } },
  { method: 'get', template: '/api/reports/999999/questions', expect: { others: 404 } },
  {
    method: 'post',
    template: '/api/reports/999999/questions',
    body: {},
    expect: { others: 404 },
  },
  {
    method: 'post',
    template: '/api/reports/999999/questions/1/answers',
    body: {},
    expect: { others: 404 },
  },
]

const pathOf = (route: RouteCase) =>
  route.template.replace(/:(\w+)/g, (_, key: keyof typeof ids) => String(ids[key]))
const label = (route: RouteCase) => `${route.method.toUpperCase()} ${route.template}`

function send(session: ApiSession, route: RouteCase) {
  if (route.method === 'get') return session.get(pathOf(route))
  return session[route.method](pathOf(route), route.body)
}

describe('every route × role', () => {
  for (const route of ROUTES) {
    it(label(route), async () => {
      for (const role of ROLES) {
        const response = await send(sessions.get(role) as ApiSession, route)
        const expected = route.expect[role] ?? route.expect.others
        expect(response.status, `${label(route)} as ${role}`).toBe(expected)
      }
    })
  }

  it('answers 401 to every route when signed out', async () => {
    for (const route of ROUTES) {
      const response = await request(app)[route.method](pathOf(route)).send(route.body)
      // writes without a CSRF token stop at 403 before the sign-in check; reads say 401
      expect(response.status, label(route)).toBe(route.method === 'get' ? 401 : 403)
    }
  })
})
