import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { seedDemoIfEmpty } from '../../seeds/demo'
import { signedIn } from '../helpers/api-session'
import { appWithUploads } from '../helpers/app-with-uploads'
import { createTestDb, resetDatabase } from '../helpers/test-db'

const db = createTestDb()
const { app, storage, cleanup } = appWithUploads(db)
const password = 'demo password 2'

beforeAll(async () => {
  await resetDatabase(db)
  await seedDemoIfEmpty(db, { password, passwordCost: 4, storage })
})
afterAll(async () => {
  await db.destroy()
  cleanup()
})

const caseIdOf = async (title: string) =>
  ((await db('cases').where({ title }).first('id')) as { id: number }).id

describe('the demo’s reports', () => {
  it('has an issued case with its review history, acknowledged, with a question and its answer', async () => {
    const caseId = await caseIdOf('Fractured slewing ring bolt, mobile crane 7')
    const client = await signedIn(app, 'client@demo.test', password)
    const list = (await client.get(`/api/cases/${caseId}/reports`).expect(200)).body.data
    expect(list.map((r: { revision: string }) => r.revision)).toEqual(['A'])
    expect(list[0].acknowledgedAt).not.toBeNull()
    const report = (await client.get(`/api/reports/${list[0].id as number}`).expect(200)).body.data
    expect(report.questions).toHaveLength(1)
    expect(report.questions[0].answers).toHaveLength(1)
    const reviewer = await signedIn(app, 'reviewer@demo.test', password)
    const review = (await reviewer.get(`/api/cases/${caseId}/review`).expect(200)).body.data
    expect(review.history.map((step: { kind: string }) => step.kind)).toEqual([
      'submitted',
      'revisions_requested',
      'submitted',
      'approved',
      'issued',
    ])
    const comments = (await reviewer.get(`/api/cases/${caseId}/review/comments`).expect(200)).body
      .data
    expect(comments).toHaveLength(2)
    expect(comments[0].resolvedAt).not.toBeNull()
  })

  it('has an amended case with revisions A and B, B naming A and why', async () => {
    const caseId = await caseIdOf('Cracked thermowell on steam header')
    const client = await signedIn(app, 'client2@demo.test', password)
    const list = (await client.get(`/api/cases/${caseId}/reports`).expect(200)).body.data
    expect(list.map((r: { revision: string }) => r.revision)).toEqual(['B', 'A'])
    expect(list[0].replaces.revision).toBe('A')
    expect(list[0].amendmentReason).toMatch(/steam temperature/)
    expect(list[1].supersededBy.revision).toBe('B')
    for (const item of list) await client.get(`/api/reports/${item.id as number}`).expect(200)
    const other = await signedIn(app, 'client@demo.test', password)
    expect((await other.get(`/api/cases/${caseId}/reports`)).status).toBe(404)
  })
})
