import type { Knex } from 'knex'

// The activity trail is append-only: deleting a case must not take its history with it, so the
// database refuses to delete a case that has activity (cases are closed, never deleted).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('audit_events', (table) => {
    table.dropForeign(['case_id'])
  })
  await knex.schema.alterTable('audit_events', (table) => {
    table.foreign('case_id').references('id').inTable('cases').onDelete('RESTRICT')
    table.index(['case_id', 'actor_id'])
    table.index(['case_id', 'action'])
  })
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('audit_events', (table) => {
    table.dropForeign(['case_id'])
  })
  await knex.schema.alterTable('audit_events', (table) => {
    table.dropIndex(['case_id', 'actor_id'])
    table.dropIndex(['case_id', 'action'])
    table.foreign('case_id').references('id').inTable('cases').onDelete('CASCADE')
  })
}
