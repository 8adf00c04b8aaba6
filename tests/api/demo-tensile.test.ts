import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { loadCaseMaterial } from '../../server/services/mechanical-tests/material-link'
import { judgeAgainstLink } from '../../shared/specifications/case-conformity'
import { analyseSpecimens, type SpecimenResult } from '../../shared/tensile'
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

describe('the demo’s tensile tests', () => {
  it('has confirmed records whose stored results are the engine’s for the stored files', async () => {
    const rows = (await db('tensile_records').orderBy('id')) as {
      storageKey: string
      sha256: string
      caseId: number
      fileName: string
      options: string | Record<string, string>
      result: string
      state: string
    }[]
    expect(rows.map((row) => row.state)).toEqual(['confirmed', 'confirmed', 'confirmed'])
    const material = await loadCaseMaterial(db, rows[0]!.caseId)
    for (const row of rows) {
      const bytes = await storage.read({ key: row.storageKey, sha256: row.sha256 })
      const options = typeof row.options === 'string' ? JSON.parse(row.options) : row.options
      const expected = analyseSpecimens(
        [{ name: row.fileName, source: bytes.toString('utf8') }],
        options,
      )
      expect(JSON.parse(row.result)).toEqual(expected)
      // the case's verdict against its linked record, beside the engine's answer
      const judged = judgeAgainstLink(expected as SpecimenResult, options, material)
      expect(judged.judged && judged.link.designation).toBe('A193-B7')
      expect(judged.judged && judged.conformity.overall).toMatch(
        /^(pass|fail|inconclusive|incomplete)$/,
      )
    }
  })
})
