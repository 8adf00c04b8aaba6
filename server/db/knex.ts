import knex, { type Knex } from 'knex'
import { quietConnectionWarnings } from './availability'

/**
 * Every identifier of every query and every column of every row passes through these: the
 * names are few, so each is converted once and remembered (bounded, in case of a flood of
 * aliases).
 */
function remembered(convert: (name: string) => string): (name: string) => string {
  const known = new Map<string, string>()
  return (name) => {
    let converted = known.get(name)
    if (converted === undefined) {
      converted = convert(name)
      if (known.size < 5_000) known.set(name, converted)
    }
    return converted
  }
}

const toSnake = remembered((name) => name.replace(/[A-Z]/g, (l) => `_${l.toLowerCase()}`))
const toCamel = remembered((name) =>
  name.replace(/_([a-z0-9])/g, (_, l: string) => l.toUpperCase()),
)

function camelizeRow(row: unknown): unknown {
  if (Array.isArray(row)) return row.map(camelizeRow)
  if (row === null || typeof row !== 'object' || row instanceof Date || Buffer.isBuffer(row)) {
    return row
  }
  const camel: Record<string, unknown> = {}
  for (const key in row) camel[toCamel(key)] = (row as Record<string, unknown>)[key]
  return camel
}

// During an outage a request should hear "unavailable" in seconds, not after the driver's own
// limits (knex waits 60 s for a connection, mysql2 10 s for a handshake). A refused connection
// fails at once anyway; these bound a server that accepts but does not answer.
const ACQUIRE_TIMEOUT_MS = 5_000
const CONNECT_TIMEOUT_MS = 3_000

/** Knex on mysql2, with camelCase in the code and snake_case in MariaDB, converted here only. */
export function createDb(url: string, poolOptions: Knex.PoolConfig = { min: 0, max: 10 }): Knex {
  // Every connection works in UTC, so TIMESTAMP columns read back as the instants they stored.
  const pool: Knex.PoolConfig = {
    ...poolOptions,
    afterCreate: (
      connection: { query: (sql: string, done: (error?: Error) => void) => void },
      done: (error?: Error) => void,
    ) => connection.query("SET time_zone = '+00:00'", (error) => done(error)),
  }
  return knex({
    client: 'mysql2',
    connection: {
      uri: url,
      charset: 'utf8mb4',
      timezone: 'Z',
      dateStrings: ['DATE'],
      connectTimeout: CONNECT_TIMEOUT_MS,
    } as never,
    pool,
    acquireConnectionTimeout: ACQUIRE_TIMEOUT_MS,
    log: { warn: quietConnectionWarnings((message) => console.warn(message)) },
    wrapIdentifier: (value, wrap) => wrap(value === '*' ? value : toSnake(value)),
    postProcessResponse: camelizeRow,
  })
}

export type Db = Knex
