import type { Knex } from 'knex'
import { NotFound } from '../../errors'
import type { Notice, Recipient } from './notice-kinds'

export interface CaseFacts {
  id: number
  number: string
  title: string
  organisationId: number
  leadInvestigatorId: number | null
  reviewerId: number | null
}

interface PersonRow {
  id: number
  name: string
  email: string
}

export async function caseFacts(db: Knex, caseId: number): Promise<CaseFacts> {
  const row = (await db('cases')
    .where({ id: caseId })
    .first('id', 'number', 'title', 'organisationId', 'leadInvestigatorId', 'reviewerId')) as
    CaseFacts | undefined
  if (!row) throw new NotFound('No such case.')
  return row
}

const asRecipient = (row: PersonRow): Recipient => ({
  personId: row.id,
  name: row.name,
  address: row.email,
})

/** Active people with these ids, from the people records only. */
async function people(db: Knex, ids: (number | null)[]): Promise<Recipient[]> {
  const wanted = ids.filter((id): id is number => id !== null)
  if (wanted.length === 0) return []
  const rows = (await db('users')
    .whereIn('id', wanted)
    .andWhere({ active: true })
    .orderBy('id')
    .select('id', 'name', 'email')) as PersonRow[]
  return rows.map(asRecipient)
}

async function clientPeople(db: Knex, organisationId: number): Promise<Recipient[]> {
  const rows = (await db('users')
    .join('user_roles', 'user_roles.user_id', 'users.id')
    .where({ 'users.organisationId': organisationId, 'users.active': true })
    .andWhere('user_roles.role', 'client')
    .orderBy('users.id')
    .select('users.id', 'users.name', 'users.email')) as PersonRow[]
  return rows.map(asRecipient)
}

async function noticeParties(db: Knex, caseId: number, noticeId: number): Promise<Recipient[]> {
  const rows = (await db('notice_parties')
    .join('notices', 'notices.id', 'notice_parties.notice_id')
    .where({ 'notices.id': noticeId, 'notices.caseId': caseId })
    .whereNotNull('notice_parties.email')
    .orderBy('notice_parties.id')
    .select('notice_parties.name', 'notice_parties.email')) as { name: string; email: string }[]
  return rows.map((row) => ({ personId: null, name: row.name, address: row.email }))
}

/** Who a notice goes to, by its kind. */
export function recipientsOf(db: Knex, notice: Notice, found: CaseFacts): Promise<Recipient[]> {
  switch (notice.kind) {
    case 'assigned':
      return people(db, [notice.personId])
    case 'review_requested':
      return people(db, [found.reviewerId])
    case 'revisions_requested':
    case 'approved':
    case 'client_question':
      return people(db, [found.leadInvestigatorId])
    case 'answer':
      return people(db, [notice.askedById])
    case 'report_issued':
      return clientPeople(db, found.organisationId)
    case 'destructive_testing_notice':
      return noticeParties(db, notice.caseId, notice.noticeId)
  }
}
