import type { Knex } from 'knex'

// The layout connect-session-knex reads and writes (sid, sess, expired).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('sessions', (table) => {
    table.string('sid', 191).primary()
    table.json('sess').notNullable()
    table.dateTime('expired').notNullable().index()
  })
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('sessions')
}
