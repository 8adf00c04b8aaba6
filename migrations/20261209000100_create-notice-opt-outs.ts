import type { Knex } from 'knex'

export async function up(knex: Knex): Promise<void> {
  // The non-essential e-mail notices a person turned off; no row means the notice is on.
  await knex.schema.createTable('notice_opt_outs', (table) => {
    table
      .integer('user_id')
      .unsigned()
      .notNullable()
      .references('id')
      .inTable('users')
      .onDelete('CASCADE')
    table.string('kind', 40).notNullable()
    table.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3))
    table.primary(['user_id', 'kind'])
  })
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('notice_opt_outs')
}
