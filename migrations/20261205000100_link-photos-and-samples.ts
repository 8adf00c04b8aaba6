import type { Knex } from 'knex'

// Photos, samples and specimens arrived side by side; now all exist, their links become keys.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('photos', (table) => {
    table.foreign('sample_id').references('id').inTable('samples').onDelete('RESTRICT')
  })
  await knex.schema.alterTable('observation_photos', (table) => {
    table.foreign('photo_id').references('id').inTable('photos').onDelete('RESTRICT')
  })
  await knex.schema.alterTable('specimens', (table) => {
    table.foreign('sample_id').references('id').inTable('samples').onDelete('RESTRICT')
  })
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('specimens', (table) => {
    table.dropForeign(['sample_id'])
  })
  await knex.schema.alterTable('observation_photos', (table) => {
    table.dropForeign(['photo_id'])
  })
  await knex.schema.alterTable('photos', (table) => {
    table.dropForeign(['sample_id'])
  })
}
