import { readdirSync, realpathSync } from 'node:fs'
import { sep } from 'node:path'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { createDb, type Db } from '../../server/db/knex'
import { ownMariadb, type OwnMariadb } from '../helpers/own-mariadb'

let first: OwnMariadb
let second: OwnMariadb
const dbs: Db[] = []

beforeAll(async () => {
  // both set up at once, as two checkouts starting together would
  const started = await Promise.allSettled([ownMariadb('tmpdir-a'), ownMariadb('tmpdir-b')])
  const [a, b] = started.map((result) => (result.status === 'fulfilled' ? result.value : undefined))
  if (!a || !b) {
    await Promise.all([a?.remove(), b?.remove()])
    throw started.find((result) => result.status === 'rejected')?.reason
  }
  ;[first, second] = [a, b]
})
afterAll(async () => {
  await Promise.all(dbs.map((db) => db.destroy()))
  await Promise.all([first?.remove(), second?.remove()])
})

async function connect(instance: OwnMariadb): Promise<Db> {
  const db = createDb(await instance.databaseUrl('fractolog_tmpdir'), { min: 1, max: 1 })
  dbs.push(db)
  return db
}

const tmpdirOf = async (db: Db) =>
  ((await db.raw('SELECT @@tmpdir AS tmpdir')) as [{ tmpdir: string }[]])[0][0]?.tmpdir ?? ''

const inside = (path: string, folder: string) =>
  realpathSync(path).startsWith(`${realpathSync(folder)}${sep}`)

describe('two private MariaDB instances on one machine', () => {
  it('each keeps its temporary files inside its own data folder', async () => {
    const [a, b] = [await connect(first), await connect(second)]
    const [tmpA, tmpB] = [await tmpdirOf(a), await tmpdirOf(b)]
    expect(tmpA).not.toBe(tmpB)
    expect(inside(tmpA, first.options.dataDir), tmpA).toBe(true)
    expect(inside(tmpB, second.options.dataDir), tmpB).toBe(true)
  })

  it('puts one instance’s temporary table where the other cannot touch it', async () => {
    const [a, b] = [await connect(first), await connect(second)]
    const tmpA = await tmpdirOf(a)
    const tmpB = await tmpdirOf(b)
    const before = readdirSync(tmpB)
    // The pool holds one connection, so the temporary table lives as long as this test.
    await a.raw('CREATE TEMPORARY TABLE scratch (n INT) ENGINE=Aria')
    await a.raw('INSERT INTO scratch VALUES (1), (2), (3)')
    expect(readdirSync(tmpA).some((name) => name.startsWith('#sql'))).toBe(true)
    expect(readdirSync(tmpB)).toEqual(before)
    // Starting the second instance again does not disturb the first one's table.
    await second.stop()
    await second.start()
    const rows = (await a.raw('SELECT COUNT(*) AS n FROM scratch')) as [{ n: number }[]]
    expect(Number(rows[0][0]?.n)).toBe(3)
  })
})
