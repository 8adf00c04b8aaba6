import type { Knex } from 'knex'
import type { CaseCreate } from '../shared/schemas/cases'
import type { Role } from '../shared/schemas/roles'
import type { CaseState } from '../shared/workflow/case-states'
import { hashPassword } from '../server/auth/passwords'
import { createCaseService } from '../server/services/cases'

// An invented scenario: the lab, its clients, people and parts are all made up.
export const DEMO_LAB_NAME = 'Kestrelmoor Materials Laboratory'

const ORGANISATIONS = [
  {
    key: 'cranes',
    name: 'Tallowmere Cranes Ltd',
    contactName: 'Dale Forsyth',
    contactEmail: 'client@demo.test',
  },
  {
    key: 'fittings',
    name: 'Quillon Process Fittings',
    contactName: 'Yuki Brennagh',
    contactEmail: 'client2@demo.test',
  },
] as const

type OrganisationKey = (typeof ORGANISATIONS)[number]['key']

const PEOPLE: { email: string; name: string; roles: Role[]; organisation?: OrganisationKey }[] = [
  { email: 'admin@demo.test', name: 'Ines Haldane', roles: ['admin'] },
  { email: 'investigator@demo.test', name: 'Tomas Reyke', roles: ['investigator'] },
  { email: 'lab@demo.test', name: 'Priya Olund', roles: ['lab'] },
  { email: 'reviewer@demo.test', name: 'Maren Costa', roles: ['reviewer', 'investigator'] },
  { email: 'client@demo.test', name: 'Dale Forsyth', roles: ['client'], organisation: 'cranes' },
  {
    email: 'client2@demo.test',
    name: 'Yuki Brennagh',
    roles: ['client'],
    organisation: 'fittings',
  },
]

type DemoCase = Omit<CaseCreate, 'organisationId' | 'leadInvestigatorId' | 'priority'> & {
  organisation: OrganisationKey
  status: CaseState
  priority: CaseCreate['priority']
}

const CASES: DemoCase[] = [
  {
    organisation: 'cranes',
    title: 'Fractured hook block pin, gantry crane 3',
    component: 'Hook block pin',
    partNumber: 'TC-HB-2207',
    material: 'AISI 4140, quenched and tempered',
    priority: 'high',
    status: 'examination',
    failureDate: '2026-10-14',
    dueDate: '2026-12-18',
  },
  {
    organisation: 'cranes',
    title: 'Cracked rope sheave on luffing hoist',
    component: 'Rope sheave',
    partNumber: 'TC-SH-0415',
    material: 'EN-GJS-500-7',
    priority: 'normal',
    status: 'drafting',
    failureDate: '2026-09-02',
    dueDate: '2026-12-05',
  },
  {
    organisation: 'cranes',
    title: 'Sheared boom foot bolt',
    component: 'Boom foot bolt M30',
    partNumber: 'TC-BF-3001',
    material: 'ASTM A193 Grade B7',
    priority: 'urgent',
    status: 'released',
    failureDate: '2026-06-21',
    dueDate: '2026-08-01',
  },
  {
    organisation: 'cranes',
    title: 'Bent outrigger beam after set-down',
    component: 'Outrigger beam',
    partNumber: null,
    material: 'EN 10025-2 S355J2',
    priority: 'low',
    status: 'intake',
    failureDate: '2026-11-20',
    dueDate: '2027-01-22',
  },
  {
    organisation: 'fittings',
    title: 'Cracked compression fitting on chloride line',
    component: 'Compression fitting 1/2 in',
    partNumber: 'QF-CF-316-08',
    material: 'ASTM A240 Type 316L',
    priority: 'high',
    status: 'in_review',
    failureDate: '2026-08-30',
    dueDate: '2026-12-12',
  },
  {
    organisation: 'fittings',
    title: 'Leak at heat-exchanger nozzle weld',
    component: 'Nozzle weld N2',
    partNumber: null,
    material: 'ASTM A240 Type 304',
    priority: 'normal',
    status: 'intake',
    failureDate: '2026-11-25',
    dueDate: '2027-02-10',
  },
  {
    organisation: 'fittings',
    title: 'Transfer pump shaft fracture',
    component: 'Pump shaft',
    partNumber: 'QF-PS-42-1180',
    material: '42CrMo4, quenched and tempered',
    priority: 'normal',
    status: 'approved',
    failureDate: '2026-07-11',
    dueDate: '2026-11-30',
  },
]

async function seedPeople(db: Knex, options: DemoOptions, organisationIds: Map<string, number>) {
  const ids = new Map<string, number>()
  for (const person of PEOPLE) {
    const [id] = (await db('users').insert({
      email: person.email,
      name: person.name,
      passwordHash: await hashPassword(options.password, options.passwordCost),
      mustChangePassword: false,
      organisationId: person.organisation ? organisationIds.get(person.organisation) : null,
    })) as number[]
    await db('user_roles').insert(person.roles.map((role) => ({ userId: id, role })))
    ids.set(person.email, id as number)
  }
  return ids
}

async function seedCases(
  db: Knex,
  organisationIds: Map<string, number>,
  people: Map<string, number>,
) {
  const cases = createCaseService(db)
  const adminId = people.get('admin@demo.test') as number
  for (const { organisation, status, ...fields } of CASES) {
    const created = await cases.create(
      {
        ...fields,
        organisationId: organisationIds.get(organisation) as number,
        leadInvestigatorId: people.get('investigator@demo.test') as number,
      },
      adminId,
    )
    await db('cases').where({ id: created.id }).update({ status })
  }
}

export interface DemoOptions {
  password: string
  passwordCost?: number
}

export function demoAccountsNote(password: string): string {
  const accounts = PEOPLE.map((person) => `  ${person.email.padEnd(24)} ${person.roles.join(', ')}`)
  return [`Demo sign-ins (${DEMO_LAB_NAME}), password "${password}":`, ...accounts].join('\n')
}

/** Seeds the invented demo scenario into an empty database; returns false when it holds people. */
export async function seedDemoIfEmpty(db: Knex, options: DemoOptions): Promise<boolean> {
  const [{ count }] = (await db('users').count({ count: '*' })) as [{ count: number }]
  if (Number(count) > 0) return false
  await db.transaction(async (trx) => {
    const organisationIds = new Map<string, number>()
    for (const { key, ...organisation } of ORGANISATIONS) {
      const [id] = (await trx('organisations').insert(organisation)) as number[]
      organisationIds.set(key, id as number)
    }
    const people = await seedPeople(trx, options, organisationIds)
    await seedCases(trx, organisationIds, people)
  })
  return true
}
