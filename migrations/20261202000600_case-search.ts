import type { Knex } from 'knex'

// Search answers from indexes: a FULLTEXT index for words of three letters or more, and a table
// of whole words (shorter grades such as "B7" included) and failure mechanisms per case.
export async function up(knex: Knex): Promise<void> {
  await knex.raw(
    'ALTER TABLE cases ADD FULLTEXT INDEX cases_search (title, component, material, client_reference)',
  )
  await knex.schema.alterTable('cases', (table) => {
    table.index(['lead_investigator_id', 'status'])
    table.index(['due_date'])
    table.index(['material'])
    table.index(['created_at'])
  })
  await knex.schema.createTable('case_terms', (table) => {
    table
      .integer('case_id')
      .unsigned()
      .notNullable()
      .references('id')
      .inTable('cases')
      .onDelete('CASCADE')
    table.enum('kind', ['word', 'mechanism']).notNullable()
    table.string('term', 64).notNullable()
    table.primary(['kind', 'term', 'case_id'])
    table.index(['case_id'])
  })
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('case_terms')
  // MariaDB let the new (lead, status) index serve the foreign key and dropped the key's own one
  await knex.schema.alterTable('cases', (table) => {
    table.index(['lead_investigator_id'], 'cases_lead_investigator_id_foreign')
  })
  await knex.schema.alterTable('cases', (table) => {
    table.dropIndex(['lead_investigator_id', 'status'])
    table.dropIndex(['due_date'])
    table.dropIndex(['material'])
    table.dropIndex(['created_at'])
  })
  await knex.raw('ALTER TABLE cases DROP INDEX cases_search')
}
