import type { Knex } from 'knex'

// The case list's usual pages read their 25 ids straight off an index, newest first: a
// client's page by organisation, a filtered page by status (the id, InnoDB's key, follows in
// each entry and breaks ties in the same order).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('cases', (table) => {
    table.index(['organisationId', 'createdAt'], 'cases_organisation_created_index')
    table.index(['status', 'createdAt'], 'cases_status_created_index')
  })
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('cases', (table) => {
    table.dropIndex(['organisationId', 'createdAt'], 'cases_organisation_created_index')
    table.dropIndex(['status', 'createdAt'], 'cases_status_created_index')
  })
}
