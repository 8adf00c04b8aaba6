import { describe, expect, it } from 'vitest'
import {
  can,
  organisationScope,
  type Actor,
  type CaseAction,
  type CaseRef,
  type GlobalAction,
} from '../../shared/access/policy'
import type { Role } from '../../shared/schemas/roles'
import { CASE_STATES, type CaseState } from '../../shared/workflow/case-states'

const actor = (role: Role, organisationId: number | null = null): Actor => ({
  id: 1,
  roles: [role],
  organisationId,
})

// Every role × action without a case: the expected answer is written out in full.
const GLOBAL: Record<GlobalAction, Record<Role, boolean>> = {
  'people.manage': { admin: true, investigator: false, lab: false, reviewer: false, client: false },
  'security.audit': {
    admin: true,
    investigator: false,
    lab: false,
    reviewer: false,
    client: false,
  },
  'organisations.manage': {
    admin: true,
    investigator: false,
    lab: false,
    reviewer: false,
    client: false,
  },
  'organisations.list': {
    admin: true,
    investigator: true,
    lab: true,
    reviewer: true,
    client: true,
  },
  'staff.list': { admin: true, investigator: true, lab: true, reviewer: true, client: false },
  'cases.list': { admin: true, investigator: true, lab: true, reviewer: true, client: true },
  'case.create': { admin: true, investigator: true, lab: false, reviewer: false, client: false },
  'specifications.list': {
    admin: true,
    investigator: true,
    lab: true,
    reviewer: true,
    client: false,
  },
  'specifications.manage': {
    admin: true,
    investigator: false,
    lab: false,
    reviewer: false,
    client: false,
  },
  'mail.manage': { admin: true, investigator: false, lab: false, reviewer: false, client: false },
  'settings.read': { admin: true, investigator: true, lab: true, reviewer: true, client: false },
  'settings.manage': {
    admin: true,
    investigator: false,
    lab: false,
    reviewer: false,
    client: false,
  },
}

describe('access policy: role × action', () => {
  for (const [action, byRole] of Object.entries(GLOBAL) as [
    GlobalAction,
    Record<Role, boolean>,
  ][]) {
    for (const [role, expected] of Object.entries(byRole) as [Role, boolean][]) {
      it(`${role} ${expected ? 'may' : 'may not'} ${action}`, () => {
        expect(can(actor(role, role === 'client' ? 7 : null), action)).toBe(expected)
      })
    }
  }
})

// The people a case can meet, each with their part in the case below (organisation 7, lead 10,
// co-investigator 11, lab technician 12, reviewer 13).
const WHO: Record<string, { actor: Actor; unled?: boolean }> = {
  admin: { actor: { id: 1, roles: ['admin'], organisationId: null } },
  lead: { actor: { id: 10, roles: ['investigator'], organisationId: null } },
  coInvestigator: { actor: { id: 11, roles: ['investigator'], organisationId: null } },
  otherInvestigator: { actor: { id: 19, roles: ['investigator'], organisationId: null } },
  investigatorOfUnledCase: {
    actor: { id: 19, roles: ['investigator'], organisationId: null },
    unled: true,
  },
  labTechnician: { actor: { id: 12, roles: ['lab'], organisationId: null } },
  otherLabTechnician: { actor: { id: 17, roles: ['lab'], organisationId: null } },
  reviewer: { actor: { id: 13, roles: ['reviewer'], organisationId: null } },
  otherReviewer: { actor: { id: 18, roles: ['reviewer'], organisationId: null } },
  ownClient: { actor: { id: 30, roles: ['client'], organisationId: 7 } },
  otherClient: { actor: { id: 31, roles: ['client'], organisationId: 8 } },
}

function caseIn(status: CaseState, unled = false): CaseRef {
  return {
    organisationId: 7,
    status,
    leadInvestigatorId: unled ? null : 10,
    coInvestigatorIds: [11],
    labTechnicianId: 12,
    reviewerId: 13,
  }
}

type ReviewAction =
  | 'case.submitForReview'
  | 'case.comment'
  | 'case.decideReview'
  | 'case.issue'
  | 'case.amend'
  | 'case.readReports'
  | 'case.acknowledgeReport'
  | 'case.askQuestion'
  | 'case.answerQuestions'

type Row = Record<Exclude<CaseAction, ReviewAction>, boolean>
const row = (
  view: boolean,
  internal: boolean,
  edit: boolean,
  move: boolean,
  evidence: { handle: boolean; release: boolean } = { handle: move, release: false },
  tests: { record: boolean; confirm: boolean } = { record: false, confirm: false },
): Row => ({
  'case.view': view,
  'case.viewInternal': internal,
  'case.viewActivity': internal,
  'case.edit': edit,
  'case.changeStatus': move,
  // the people who move a case along also keep its service history
  'case.editHistory': move,
  // evidence: those who move the case along, plus its lab technician, handle the samples; the
  // people who edit the record place holds; only administrators release them
  'case.handleEvidence': evidence.handle,
  'case.placeHold': edit,
  'case.releaseEvidence': evidence.release,
  // photographs: the people who move the case along, and the case's lab technician
  'case.editPhotos': evidence.handle,
  'case.recordTests': tests.record,
  'case.confirmTests': tests.confirm,
  // every staff member reads the findings draft; who writes it depends on the state (below)
  'case.readFindings': internal,
  'case.editFindings': false,
})

// Only the case's own investigators write the findings, while a draft is being worked on: from
// examination until approval (an edit of an approved draft reopens it), never after issue.
const FINDINGS_WRITERS = ['lead', 'coInvestigator']
const FINDINGS_OPEN_IN: CaseState[] = ['examination', 'drafting', 'revisions_requested', 'approved']

// Test records: the case's lab technician, its lead and administrators record them; only the
// case's lab technician and administrators confirm them.
const RECORDS_AND_CONFIRMS = { record: true, confirm: true }
const RECORDS = { record: true, confirm: false }

// While a case is open (every state but closed): view, internal view and activity, edit, move.
const OPEN: Record<keyof typeof WHO, Row> = {
  admin: row(true, true, true, true, { handle: true, release: true }, RECORDS_AND_CONFIRMS),
  lead: row(true, true, true, true, undefined, RECORDS),
  coInvestigator: row(true, true, false, true),
  otherInvestigator: row(true, true, false, false),
  investigatorOfUnledCase: row(true, true, true, true),
  labTechnician: row(
    true,
    true,
    false,
    false,
    { handle: true, release: false },
    RECORDS_AND_CONFIRMS,
  ),
  otherLabTechnician: row(true, true, false, false),
  reviewer: row(true, true, false, false),
  otherReviewer: row(true, true, false, false),
  ownClient: row(true, false, false, false),
  otherClient: row(false, false, false, false),
}

// Once closed, the case is read-only for everybody.
const CLOSED: Record<keyof typeof WHO, Row> = {
  admin: row(true, true, false, false),
  lead: row(true, true, false, false),
  coInvestigator: row(true, true, false, false),
  otherInvestigator: row(true, true, false, false),
  investigatorOfUnledCase: row(true, true, false, false),
  labTechnician: row(true, true, false, false),
  otherLabTechnician: row(true, true, false, false),
  reviewer: row(true, true, false, false),
  otherReviewer: row(true, true, false, false),
  ownClient: row(true, false, false, false),
  otherClient: row(false, false, false, false),
}

// Review and reports: the lead (or an administrator) submits, issues, amends and answers the
// client; the assigned reviewer decides (four eyes is checked on top, against the draft's
// authors); the people on the case comment while the review is open; every staff member and the
// case's own client read the issued revisions; only that client acknowledges and asks.
function reviewRow(who: string, status: CaseState): Record<ReviewAction, boolean> {
  const leads = who === 'lead' || who === 'admin'
  const talks = leads || who === 'coInvestigator' || who === 'reviewer'
  const client = who === 'ownClient'
  return {
    'case.submitForReview': leads && ['drafting', 'revisions_requested'].includes(status),
    'case.comment':
      talks && ['drafting', 'in_review', 'revisions_requested', 'approved'].includes(status),
    'case.decideReview': who === 'reviewer' && status === 'in_review',
    'case.issue': leads && status === 'approved',
    'case.amend': leads && ['issued', 'closed'].includes(status),
    'case.readReports': who !== 'otherClient',
    'case.acknowledgeReport': client,
    'case.askQuestion': client,
    'case.answerQuestions': leads,
  }
}

describe('access policy: person × part × case action × state', () => {
  for (const status of CASE_STATES) {
    const table = status === 'closed' ? CLOSED : OPEN
    for (const [who, row] of Object.entries(table)) {
      const { actor: person, unled } = WHO[who]!
      const writes = FINDINGS_WRITERS.includes(who) && FINDINGS_OPEN_IN.includes(status)
      const expected = { ...row, 'case.editFindings': writes, ...reviewRow(who, status) }
      it(`${who} on a case in ${status}`, () => {
        const answers = Object.fromEntries(
          (Object.keys(expected) as CaseAction[]).map((action) => [
            action,
            can(person, action, caseIn(status, unled)),
          ]),
        )
        expect(answers).toEqual(expected)
      })
    }
  }

  it('combines roles: a reviewer who is also an investigator may open cases', () => {
    const both: Actor = { id: 2, roles: ['reviewer', 'investigator'], organisationId: null }
    expect(can(both, 'case.create')).toBe(true)
  })

  it('lets a person holding investigator and reviewer roles decide only as the assigned reviewer', () => {
    const both: Actor = { id: 13, roles: ['reviewer', 'investigator'], organisationId: null }
    expect(can(both, 'case.decideReview', caseIn('in_review'))).toBe(true)
    expect(can({ ...both, id: 10 }, 'case.decideReview', caseIn('in_review'))).toBe(false)
  })

  it('lets a lab technician not assigned to the case neither record nor confirm its tests', () => {
    const otherLab: Actor = { id: 17, roles: ['lab'], organisationId: null }
    expect(can(otherLab, 'case.recordTests', caseIn('examination'))).toBe(false)
    expect(can(otherLab, 'case.confirmTests', caseIn('examination'))).toBe(false)
  })

  it('never lets a client without an organisation reach a case', () => {
    expect(can(actor('client', null), 'case.view', caseIn('intake'))).toBe(false)
  })

  it('limits a client’s lists to their organisation, and staff lists to none', () => {
    expect(organisationScope(actor('client', 7))).toBe(7)
    expect(organisationScope(actor('client', null))).toBe(-1)
    expect(organisationScope(actor('lab'))).toBeUndefined()
  })
})
