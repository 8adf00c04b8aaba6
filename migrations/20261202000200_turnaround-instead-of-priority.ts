import type { Knex } from 'knex'

// The lab's turnaround classes replace the old priority ladder:
// low and normal → standard, high → expedited, urgent → rush.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('cases', (table) => {
    table.enum('turnaround', ['standard', 'expedited', 'rush']).notNullable().defaultTo('standard')
  })
  await knex.raw(
    "UPDATE cases SET turnaround = CASE priority WHEN 'high' THEN 'expedited' WHEN 'urgent' THEN 'rush' ELSE 'standard' END",
  )
  await knex.schema.alterTable('cases', (table) => {
    table.dropColumn('priority')
  })
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('cases', (table) => {
    table.enum('priority', ['low', 'normal', 'high', 'urgent']).notNullable().defaultTo('normal')
  })
  await knex.raw(
    "UPDATE cases SET priority = CASE turnaround WHEN 'expedited' THEN 'high' WHEN 'rush' THEN 'urgent' ELSE 'normal' END",
  )
  await knex.schema.alterTable('cases', (table) => {
    table.dropColumn('turnaround')
  })
}
