import type { Knex } from 'knex'

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('hardness_sets', (table) => {
    table.increments('id')
    table
      .integer('case_id')
      .unsigned()
      .notNullable()
      .references('id')
      .inTable('cases')
      .onDelete('RESTRICT')
    table.string('scale', 8).notNullable()
    /** the readings as taken, a JSON list of numbers */
    table.text('readings').notNullable()
    table.string('load', 50).nullable()
    table.string('location', 191).nullable()
    table.integer('specimen_id').unsigned().nullable().references('id').inTable('specimens')
    table.integer('sample_id').unsigned().nullable().references('id').inTable('samples')
    table.date('tested_on').nullable()
    table.integer('recorded_by').unsigned().notNullable().references('id').inTable('users')
    table.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3))
    table.index(['case_id'])
  })
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('hardness_sets')
}
