import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createFindingsService } from '../../server/services/findings'
import { figuresOf } from '../../shared/findings/figures'
import { opinionsOf } from '../../shared/findings/flags'
import { seedDemoIfEmpty } from '../../seeds/demo'
import { temporaryStorage } from '../helpers/app-with-uploads'
import { createTestDb, resetDatabase } from '../helpers/test-db'

const db = createTestDb()
const { storage, cleanup } = temporaryStorage()

beforeAll(async () => {
  await resetDatabase(db)
  await seedDemoIfEmpty(db, { password: 'demo password 1', passwordCost: 4, storage })
})
afterAll(async () => {
  await db.destroy()
  cleanup()
})

describe('the demo’s findings', () => {
  it('gives each drafting case a draft with figures of its own stored photos and cited observations', async () => {
    const drafting = (await db('cases')
      .where({ status: 'drafting' })
      .select('id', 'leadInvestigatorId')) as {
      id: number
      leadInvestigatorId: number
    }[]
    expect(drafting.length).toBe(3)
    const findings = createFindingsService()
    for (const { id, leadInvestigatorId } of drafting) {
      const lead = {
        id: leadInvestigatorId,
        roles: ['investigator' as const],
        organisationId: null,
      }
      const view = await findings.read({ actor: lead, db }, id)
      expect(view.version).toBe(1)
      expect(view.flags).toEqual([])
      expect(view.authors.map((a) => a.id)).toEqual([leadInvestigatorId])
      const figures = figuresOf(view.doc)
      expect(figures.length).toBeGreaterThan(0)
      for (const figure of figures) {
        const photo = await db('photos').where({ id: figure.attrs.photoId, caseId: id }).first()
        expect(photo, `photo ${figure.attrs.photoId}`).toBeDefined()
        const bytes = await storage.read({ key: photo.originalKey, sha256: photo.sha256 })
        expect(bytes.subarray(0, 2).toString('hex')).toBe('ffd8') // JPEG start of image
        expect(view.html).toContain(`/api/photos/${figure.attrs.photoId}/figure`)
      }
      const cited = opinionsOf(view.doc).flatMap((o) => o.observations)
      expect(cited.length).toBeGreaterThan(0)
      const numbers = await db('observations').where({ caseId: id }).pluck('number')
      for (const n of cited) expect(numbers).toContain(n)
    }
  })
})
