import { mkdtempSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import type { Knex } from 'knex'
import { createLocalStorage } from '../../server/storage/local-storage'
import { seedDemoIfEmpty } from '../../seeds/demo'
import { dropAllTables, migrateLatest } from '../../server/db/migrations'

/*
 * The benchmark's data: the demo scenario (people, two client organisations, a handful of cases
 * in real states), twenty more client organisations, and copies of the demo's cases up to the
 * wanted count. Copying whole rows in SQL keeps this independent of the case columns: only the
 * number, title, organisation and creation time differ between copies.
 */

const EXTRA_ORGANISATIONS = 20
export const BENCH_PASSWORD = 'bench-password-only'

async function caseColumns(db: Knex): Promise<string[]> {
  const [rows] = (await db.raw(
    'SELECT COLUMN_NAME AS name FROM information_schema.COLUMNS WHERE TABLE_SCHEMA = DATABASE() AND TABLE_NAME = ? ORDER BY ORDINAL_POSITION',
    ['cases'],
  )) as [{ name: string }[]]
  return rows.map((row) => row.name)
}

const VARIED: Record<string, string> = {
  number: "CONCAT('FL-B', LPAD(s.seq, 6, '0'))",
  title: "CONCAT(t.title, ' ', s.seq)",
  organisation_id: 'ELT(1 + s.seq MOD :organisationCount, :organisationIds)',
  // spread over about three years, newest last, as a lab's list grows
  created_at: 'TIMESTAMPADD(MINUTE, s.seq * 150, :start)',
  updated_at: 'TIMESTAMPADD(MINUTE, s.seq * 150, :start)',
}

/** Copies the template cases round-robin until the table holds `total` cases. */
async function copyCases(db: Knex, total: number): Promise<void> {
  const templates = (await db('cases').pluck('id')) as number[]
  const organisationIds = (await db('organisations').pluck('id')) as number[]
  const columns = (await caseColumns(db)).filter((name) => name !== 'id')
  const copies = total - templates.length
  const values = columns.map((name) => VARIED[name] ?? `t.\`${name}\``)
  // MariaDB's sequence engine gives the numbers 1..copies as a table.
  const sql = `INSERT INTO cases (${columns.map((name) => `\`${name}\``).join(', ')})
    SELECT ${values.join(', ')} FROM seq_1_to_${copies} s
    JOIN cases t ON t.id = ELT(1 + s.seq MOD ${templates.length}, ${templates.join(', ')})`
  const bound = sql
    .replaceAll(':organisationCount', String(organisationIds.length))
    .replaceAll(':organisationIds', organisationIds.join(', '))
    .replaceAll(':start', "'2023-01-01 08:00:00'")
  await db.raw(bound)
}

/** Empties the database, migrates and seeds `total` cases; returns the number of cases. */
export async function seedBenchData(db: Knex, total: number): Promise<number> {
  await dropAllTables(db)
  await migrateLatest(db)
  const storage = createLocalStorage(mkdtempSync(join(tmpdir(), 'fractolog-bench-uploads-')))
  await seedDemoIfEmpty(db, { password: BENCH_PASSWORD, passwordCost: 10, storage })
  const names = Array.from({ length: EXTRA_ORGANISATIONS }, (_, index) => ({
    name: `Bench client ${String(index + 1).padStart(2, '0')}`,
  }))
  await db('organisations').insert(names)
  await copyCases(db, total)
  await db.raw('ANALYZE TABLE cases, organisations, users, sessions')
  const [{ count }] = (await db('cases').count({ count: '*' })) as [{ count: number }]
  return Number(count)
}
