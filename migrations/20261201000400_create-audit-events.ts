import type { Knex } from 'knex'

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('audit_events', (table) => {
    table.bigIncrements('id')
    table
      .integer('case_id')
      .unsigned()
      .nullable()
      .references('id')
      .inTable('cases')
      .onDelete('CASCADE')
    table
      .integer('actor_id')
      .unsigned()
      .nullable()
      .references('id')
      .inTable('users')
      .onDelete('SET NULL')
    table.string('action', 64).notNullable()
    table.json('details').nullable()
    table.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3))
    table.index(['case_id', 'created_at'])
  })
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('audit_events')
}
