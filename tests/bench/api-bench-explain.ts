import type { Knex } from 'knex'
import request from 'supertest'
import { createApp } from '../../server/app'
import { testConfig } from '../helpers/test-config'

/*
 * Which statements the API runs for one request, and MariaDB's plan for each SELECT: the app is
 * built once more inside the benchmark, on the same database, and every query it sends is noted.
 */

interface Statement {
  sql: string
  bindings: readonly unknown[]
}

export interface RequestStatements {
  statements: Statement[]
  plans: string[]
}

function planLines(rows: Record<string, unknown>[]): string[] {
  return rows.map((row) =>
    [
      // knex's answer is camel-cased like every row (select_type → selectType)
      `${row.selectType} ${row.table}`,
      `type=${row.type}`,
      `key=${row.key ?? '—'}`,
      `rows=${row.rows}`,
      row.Extra ? `(${row.Extra})` : '',
    ].join(' '),
  )
}

/** Runs the request once through the app and explains each SELECT it sent. */
export async function explainRequest(
  db: Knex,
  path: string,
  cookie: string,
): Promise<RequestStatements> {
  const app = createApp({ db, config: testConfig(), clientDir: '/nonexistent' })
  const statements: Statement[] = []
  const note = (query: { sql: string; bindings?: readonly unknown[] }) =>
    statements.push({ sql: query.sql, bindings: query.bindings ?? [] })
  // the first request warms the app up (the session store checks its table once, the session's
  // expiry may be due); the second shows what every later request costs
  await request(app).get(path).set('Cookie', cookie).expect(200)
  db.on('query', note)
  try {
    await request(app).get(path).set('Cookie', cookie).expect(200)
  } finally {
    db.removeListener('query', note)
  }
  const plans: string[] = []
  for (const { sql, bindings } of statements) {
    if (!/^\s*select/i.test(sql) || !/`cases`/.test(sql)) continue
    const [rows] = (await db.raw(`EXPLAIN ${sql}`, bindings as Knex.RawBinding[])) as [
      Record<string, unknown>[],
    ]
    plans.push(
      `  ${sql.replace(/\s+/g, ' ').slice(0, 160)}`,
      ...planLines(rows).map((line) => `    ${line}`),
    )
  }
  return { statements, plans }
}
