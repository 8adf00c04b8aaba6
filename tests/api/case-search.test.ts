import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createApp } from '../../server/app'
import { makeCase, makeOrganisation, makePerson, type TestPerson } from '../factories'
import { signedIn, type ApiSession } from '../helpers/api-session'
import { testConfig } from '../helpers/test-config'
import { createTestDb, resetDatabase } from '../helpers/test-db'

const db = createTestDb()
const app = createApp({ db, config: testConfig(), clientDir: '/nonexistent' })
let staff: ApiSession
let client: ApiSession
let lead: TestPerson
const ids = {} as Record<'sheave' | 'bolt' | 'shaft' | 'other', number>
const numbers = {} as Record<keyof typeof ids, string>

beforeAll(async () => {
  await resetDatabase(db)
  const own = await makeOrganisation(db)
  const other = await makeOrganisation(db)
  const admin = await makePerson(db, ['admin'])
  lead = await makePerson(db, ['investigator'])
  const clientPerson = await makePerson(db, ['client'], { organisationId: own })
  staff = await signedIn(app, admin.email, admin.password)
  client = await signedIn(app, clientPerson.email, clientPerson.password)
  const made = {
    sheave: await makeCase(db, own, admin.id, {
      title: 'Cracked rope sheave on the luffing hoist',
      component: 'Rope sheave',
      material: 'EN-GJS-500-7',
      clientReference: 'NCR-7781',
      dueDate: '2026-01-10',
      mechanisms: [{ mechanism: 'fatigue_high_cycle', primary: true }],
    }),
    bolt: await makeCase(db, own, admin.id, {
      title: 'Sheared flange bolt',
      component: 'Flange bolt M24',
      material: 'ASTM A193 Grade B7',
      safetyCritical: true,
      leadInvestigatorId: lead.id,
    }),
    shaft: await makeCase(db, own, admin.id, {
      title: 'Pump shaft fracture at keyway',
      component: 'Pump shaft',
      material: '42CrMo4, quenched and tempered',
      coInvestigatorIds: [lead.id],
    }),
    other: await makeCase(db, other, admin.id, {
      title: 'Sheared anchor bolt',
      component: 'Anchor bolt',
      material: 'Grade B7',
    }),
  }
  for (const key of Object.keys(made) as (keyof typeof ids)[]) {
    ids[key] = made[key].id
    numbers[key] = made[key].number
  }
})
afterAll(() => db.destroy())

async function found(session: ApiSession, query: string): Promise<number[]> {
  const response = await session.get(`/api/cases?${query}`)
  expect(response.status, `${query}: ${JSON.stringify(response.body)}`).toBe(200)
  return response.body.data.map((item: { id: number }) => item.id).sort()
}
const sorted = (...values: number[]) => [...values].sort()

describe('search', () => {
  it('finds a word in the middle of a title through the FULLTEXT index', async () => {
    expect(await found(staff, 'q=luffing')).toEqual([ids.sheave])
    expect(await found(staff, 'q=keyway')).toEqual([ids.shaft])
  })

  it('matches the beginning of a word, so "shea" finds sheave and sheared', async () => {
    expect(await found(staff, 'q=shea')).toEqual(sorted(ids.sheave, ids.bolt, ids.other))
    expect(await found(staff, 'q=shea%20rope')).toEqual([ids.sheave])
  })

  it('goes to the number for text shaped like a case number, exact or as a prefix', async () => {
    expect(await found(staff, `q=${numbers.bolt}`)).toEqual([ids.bolt])
    expect(await found(staff, `q=${numbers.bolt.toLowerCase()}`)).toEqual([ids.bolt])
    const prefix = numbers.bolt.slice(0, 8) // FL-2026-
    expect((await found(staff, `q=${prefix}`)).length).toBe(4)
  })

  it('matches short grades such as B7 as whole words of component or material', async () => {
    expect(await found(staff, 'q=B7')).toEqual(sorted(ids.bolt, ids.other))
    expect(await found(staff, 'q=M24')).toEqual([ids.bolt])
    expect(await found(staff, 'q=B')).toEqual([])
  })

  it('treats operators and quotes as plain text, never as query syntax', async () => {
    for (const text of ['-sheave', '"sheave', 'sheave*', '+(>sheave<)', '@3 ~x']) {
      const response = await staff.get(`/api/cases?q=${encodeURIComponent(text)}`)
      expect(response.status, text).toBe(200)
    }
    expect(await found(staff, `q=${encodeURIComponent('-sheave')}`)).toEqual([ids.sheave])
  })

  it('keeps a client inside their organisation', async () => {
    expect(await found(client, 'q=B7')).toEqual([ids.bolt])
  })
})

describe('filters and sorting', () => {
  it('filters by investigator (lead or co-investigator), safety-critical, material, mechanism, overdue', async () => {
    expect(await found(staff, `investigatorId=${lead.id}`)).toEqual(sorted(ids.bolt, ids.shaft))
    expect(await found(staff, 'safetyCritical=true')).toEqual([ids.bolt])
    expect(await found(staff, 'material=42CrMo4')).toEqual([ids.shaft])
    expect(await found(staff, 'mechanism=fatigue_high_cycle')).toEqual([ids.sheave])
    expect(await found(staff, 'overdue=true')).toEqual([ids.sheave])
  })

  it('sorts by a named column in either order', async () => {
    const asc = await staff.get('/api/cases?sort=title&order=asc').expect(200)
    const titles = asc.body.data.map((item: { title: string }) => item.title)
    expect(titles).toEqual([...titles].sort((a: string, b: string) => a.localeCompare(b)))
    const desc = await staff.get('/api/cases?sort=title&order=desc').expect(200)
    expect(desc.body.data.map((item: { title: string }) => item.title)).toEqual(
      [...titles].reverse(),
    )
    await staff.get('/api/cases?sort=password').expect(400)
    await staff.get('/api/cases?overdue=yes').expect(400)
  })

  it('refuses the working filters to clients', async () => {
    const response = await client.get(`/api/cases?investigatorId=${lead.id}`)
    expect(response.status).toBe(400)
  })
})

describe('the plan MariaDB chooses', () => {
  async function explain(sql: string, bindings: string[]) {
    const [rows] = (await db.raw(`EXPLAIN ${sql}`, bindings)) as [
      { table: string; type: string; key: string | null }[],
    ]
    return rows
  }

  it('answers a word search from the FULLTEXT index', async () => {
    const plan = await explain(
      'SELECT id FROM cases WHERE MATCH (title, component, material, client_reference) AGAINST (? IN BOOLEAN MODE)',
      ['+luffing*'],
    )
    expect(plan[0]).toMatchObject({ table: 'cases', type: 'fulltext', key: 'cases_search' })
  })

  it('answers a number and a short word from their indexes', async () => {
    const byNumber = await explain('SELECT id FROM cases WHERE number LIKE ?', ['FL-2026-00%'])
    expect(byNumber[0]?.key).toBe('cases_number_unique')
    const byWord = await explain(
      "SELECT case_id FROM case_terms WHERE kind = 'word' AND term = ?",
      ['b7'],
    )
    expect(byWord[0]?.key).toBe('PRIMARY')
  })
})
