import knex, { type Knex } from 'knex'

const toSnake = (name: string) => name.replace(/[A-Z]/g, (letter) => `_${letter.toLowerCase()}`)
const toCamel = (name: string) =>
  name.replace(/_([a-z0-9])/g, (_, letter: string) => letter.toUpperCase())

function camelizeRow(row: unknown): unknown {
  if (Array.isArray(row)) return row.map(camelizeRow)
  if (row === null || typeof row !== 'object' || row instanceof Date || Buffer.isBuffer(row)) {
    return row
  }
  return Object.fromEntries(Object.entries(row).map(([key, value]) => [toCamel(key), value]))
}

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
    connection: { uri: url, charset: 'utf8mb4', timezone: 'Z', dateStrings: ['DATE'] } as never,
    pool,
    wrapIdentifier: (value, wrap) => wrap(value === '*' ? value : toSnake(value)),
    postProcessResponse: camelizeRow,
  })
}

export type Db = Knex
