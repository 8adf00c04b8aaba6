import type { Knex } from 'knex'

const CASE_STATES = [
  'intake',
  'examination',
  'drafting',
  'in_review',
  'revisions_requested',
  'approved',
  'released',
  'closed',
]

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('case_number_counters', (table) => {
    table.integer('year').unsigned().primary()
    table.integer('last_value').unsigned().notNullable()
  })
  await knex.schema.createTable('cases', (table) => {
    table.increments('id')
    table.string('number', 32).notNullable().unique()
    table.string('title', 191).notNullable()
    table
      .integer('organisation_id')
      .unsigned()
      .notNullable()
      .references('id')
      .inTable('organisations')
      .onDelete('RESTRICT')
    table.string('component', 191).notNullable()
    table.string('part_number', 100).nullable()
    table.string('material', 191).notNullable()
    table.enum('status', CASE_STATES).notNullable().defaultTo('intake')
    table.enum('priority', ['low', 'normal', 'high', 'urgent']).notNullable().defaultTo('normal')
    table
      .integer('lead_investigator_id')
      .unsigned()
      .nullable()
      .references('id')
      .inTable('users')
      .onDelete('RESTRICT')
    table.date('failure_date').nullable()
    table.date('due_date').nullable()
    table.integer('created_by').unsigned().notNullable().references('id').inTable('users')
    table.timestamps(true, true)
    table.index(['status'])
    table.index(['organisation_id', 'status'])
  })
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('cases')
  await knex.schema.dropTable('case_number_counters')
}
