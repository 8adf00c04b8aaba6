import type { Knex } from 'knex'
import type { Actor } from '../shared/access/policy'
import { CaseCreate } from '../shared/schemas/cases'
import { findTransition, type CaseState } from '../shared/workflow/case-states'
import { hashPassword } from '../server/auth/passwords'
import { createCaseService } from '../server/services/cases'
import { createServiceEventService } from '../server/services/service-events'
import { ServiceEventCreate } from '../shared/schemas/service-events'
import type { FileStorage } from '../server/storage/file-storage'
import { seedDemoFindings } from './demo-findings'
import { linkDemoMaterial, seedDemoTensile } from './demo-tensile'
import { seedDemoReport } from './demo-reports'
import {
  CASES,
  DEMO_LAB_ADDRESS,
  DEMO_LAB_NAME,
  ORGANISATIONS,
  PEOPLE,
  type DemoCase,
} from './demo-scenario'

export { DEMO_LAB_NAME } from './demo-scenario'

export interface DemoOptions {
  password: string
  passwordCost?: number
  /** the day the scenario is seeded; its dates are relative to it */
  today?: Date
  /** where the demo's stored files (raw tensile records) go */
  storage: FileStorage
  /** the second-factor key every demo account is enrolled with (base32) */
  totpSecret?: string
}

/** The shared second-factor key of the demo accounts unless DEMO_TOTP_SECRET names another. */
export const DEFAULT_DEMO_TOTP_SECRET = 'FRACTOLOGDEMOKEY'

const WAY_TO: Record<DemoCase['status'], CaseState[]> = {
  intake: [],
  examination: ['examination'],
  drafting: ['examination', 'drafting'],
}

/** Who reads each organisation's reports in the demo. */
const CLIENT_OF: Record<DemoCase['organisation'], string> = { cranes: 'dale', fittings: 'yuki' }

function daysFrom(today: Date, days: number): string {
  return new Date(today.getTime() + days * 86_400_000).toISOString().slice(0, 10)
}

async function seedPeople(trx: Knex, options: DemoOptions, organisationIds: Map<string, number>) {
  const actors = new Map<string, Actor>()
  const passwordHash = await hashPassword(options.password, options.passwordCost)
  for (const person of PEOPLE) {
    const organisationId = person.organisation ? organisationIds.get(person.organisation)! : null
    const [id] = (await trx('users').insert({
      email: person.email,
      name: person.name,
      passwordHash,
      mustChangePassword: false,
      organisationId,
      secondFactorSecret: options.totpSecret ?? DEFAULT_DEMO_TOTP_SECRET,
      secondFactorEnrolledAt: new Date(),
    })) as number[]
    await trx('user_roles').insert(person.roles.map((role) => ({ userId: id, role })))
    actors.set(person.key, { id: id as number, roles: person.roles, organisationId })
  }
  return actors
}

function caseInput(
  demo: DemoCase,
  today: Date,
  organisationIds: Map<string, number>,
  actors: Map<string, Actor>,
): CaseCreate {
  const {
    organisation,
    lead,
    coInvestigators,
    lab,
    reviewer,
    status: _s,
    history: _h,
    tensileTested: _t,
    report: _r,
    ...rest
  } = demo
  const { failedDaysAgo, receivedDaysAgo, dueInDays, ...fields } = rest
  const idOf = (key: string | undefined) => (key ? actors.get(key)!.id : null)
  return CaseCreate.parse({
    ...fields,
    organisationId: organisationIds.get(organisation),
    leadInvestigatorId: idOf(lead),
    coInvestigatorIds: (coInvestigators ?? []).map((key) => idOf(key)),
    labTechnicianId: idOf(lab),
    reviewerId: idOf(reviewer),
    failureDate: daysFrom(today, -failedDaysAgo),
    receivedOn: daysFrom(today, -receivedDaysAgo),
    dueDate: daysFrom(today, dueInDays),
  })
}

/** Opens each demo case as the administrator and moves it on as its lead, step by step. */
async function seedHistory(
  trx: Knex,
  demo: DemoCase,
  caseId: number,
  lead: Actor,
  today: Date,
  storage: FileStorage,
) {
  const events = createServiceEventService({ storage, clock: () => today })
  for (const { daysAgo, ...event } of demo.history ?? []) {
    const input = ServiceEventCreate.parse({ ...event, occurredOn: daysFrom(today, -daysAgo) })
    await events.create({ actor: lead, db: trx }, caseId, input)
  }
}

async function seedCases(
  trx: Knex,
  today: Date,
  organisationIds: Map<string, number>,
  actors: Map<string, Actor>,
  storage: FileStorage,
) {
  const cases = createCaseService({ clock: () => today })
  const admin = actors.get('admin')!
  for (const demo of CASES) {
    const input = caseInput(demo, today, organisationIds, actors)
    const created = await cases.create({ actor: admin, db: trx }, input)
    const lead = actors.get(demo.lead)!
    await seedHistory(trx, demo, created.id, lead, today, storage)
    let status = created.status
    for (const next of WAY_TO[demo.status]) {
      if (!findTransition(status, next)) throw new Error(`demo: no way from ${status} to ${next}`)
      status = (await cases.changeStatus({ actor: lead, db: trx }, created.id, next)).status
    }
    if (demo.tensileTested) await linkDemoMaterial(trx, cases, created.id, lead)
    if (demo.tensileTested && demo.lab)
      await seedDemoTensile(trx, created.id, actors.get(demo.lab)!, storage, daysFrom(today, -20))
    if (demo.status === 'drafting')
      await seedDemoFindings(trx, created.id, demo.title, lead, storage, today)
    if (demo.report && demo.reviewer) {
      const people = {
        lead,
        reviewer: actors.get(demo.reviewer)!,
        client: actors.get(CLIENT_OF[demo.organisation])!,
      }
      await seedDemoReport(trx, created.id, demo.report, people, storage)
    }
  }
}

export function demoAccountsNote(password: string, totpSecret = DEFAULT_DEMO_TOTP_SECRET): string {
  const accounts = PEOPLE.map((person) => `  ${person.email.padEnd(24)} ${person.roles.join(', ')}`)
  return [
    `Demo sign-ins (${DEMO_LAB_NAME}), password "${password}":`,
    ...accounts,
    `Two-factor sign-in: every demo account is enrolled with the key ${totpSecret}`,
    '(add it to an authenticator app as a time-based key, or compute the 6-digit code from it).',
  ].join('\n')
}

/** Seeds the invented demo scenario into an empty database; returns false when it holds people. */
export async function seedDemoIfEmpty(db: Knex, options: DemoOptions): Promise<boolean> {
  const [{ count }] = (await db('users').count({ count: '*' })) as [{ count: number }]
  if (Number(count) > 0) return false
  const today = options.today ?? new Date()
  await db.transaction(async (trx) => {
    const organisationIds = new Map<string, number>()
    for (const { key, ...organisation } of ORGANISATIONS) {
      const [id] = (await trx('organisations').insert(organisation)) as number[]
      organisationIds.set(key, id as number)
    }
    const actors = await seedPeople(trx, options, organisationIds)
    await seedCases(trx, today, organisationIds, actors, options.storage)
    await trx('laboratory_settings').insert({
      id: 1,
      name: DEMO_LAB_NAME,
      addressLines: JSON.stringify(DEMO_LAB_ADDRESS),
    })
  })
  return true
}
