import type { Knex } from 'knex'

// Keys a client sends with a request it may send twice (a double click, a retry after a lost
// answer): the first request's answer is kept for 24 hours and given again for the same key.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('idempotency_keys', (table) => {
    table.bigIncrements('id')
    table
      .integer('user_id')
      .unsigned()
      .notNullable()
      .references('id')
      .inTable('users')
      .onDelete('CASCADE')
    table.string('client_key', 191).notNullable()
    /** SHA-256 of the request the key was first used for (method, path and body) */
    table.specificType('request_hash', 'CHAR(64)').notNullable()
    // written in the same transaction as the key, so a committed key always has its answer
    table.smallint('response_status').unsigned().nullable()
    table.text('response_body', 'mediumtext').nullable()
    table.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3))
    table.unique(['user_id', 'client_key'])
    table.index(['created_at'])
  })
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('idempotency_keys')
}
