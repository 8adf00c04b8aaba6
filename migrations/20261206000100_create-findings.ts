import type { Knex } from 'knex'

export async function up(knex: Knex): Promise<void> {
  // One findings draft per case, stored as the editor's JSON (checked on every save).
  await knex.schema.createTable('findings', (table) => {
    table
      .integer('case_id')
      .unsigned()
      .primary()
      .references('id')
      .inTable('cases')
      .onDelete('RESTRICT')
    table.specificType('doc', 'LONGTEXT').notNullable()
    table.integer('version').unsigned().notNullable()
    table.integer('updated_by').unsigned().notNullable().references('id').inTable('users')
    table.timestamp('updated_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3))
    table.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3))
  })
  // Everyone who saved the draft since the last issued revision (the four-eyes rule reads it).
  await knex.schema.createTable('findings_authors', (table) => {
    table.integer('case_id').unsigned().notNullable().references('id').inTable('cases')
    table.integer('person_id').unsigned().notNullable().references('id').inTable('users')
    table.timestamp('first_saved_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3))
    table.timestamp('last_saved_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3))
    table.primary(['case_id', 'person_id'])
  })
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('findings_authors')
  await knex.schema.dropTable('findings')
}
