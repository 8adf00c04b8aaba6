import type { Knex } from 'knex'

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('observations', (table) => {
    table.increments('id')
    table
      .integer('case_id')
      .unsigned()
      .notNullable()
      .references('id')
      .inTable('cases')
      .onDelete('RESTRICT')
    /** O-<number>: assigned once per case and never reused */
    table.integer('number').unsigned().notNullable()
    table.text('text').notNullable()
    table.integer('recorded_by').unsigned().notNullable().references('id').inTable('users')
    table.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3))
    table.text('withdraw_reason').nullable()
    table.integer('withdrawn_by').unsigned().nullable().references('id').inTable('users')
    table.timestamp('withdrawn_at', { precision: 3 }).nullable()
    table.unique(['case_id', 'number'])
  })
  await knex.schema.createTable('observation_samples', (table) => {
    table
      .integer('observation_id')
      .unsigned()
      .notNullable()
      .references('id')
      .inTable('observations')
    table.integer('sample_id').unsigned().notNullable().references('id').inTable('samples')
    table.primary(['observation_id', 'sample_id'])
  })
  // The photos feature lands separately and adds the foreign key from photo_id to photos.id.
  await knex.schema.createTable('observation_photos', (table) => {
    table
      .integer('observation_id')
      .unsigned()
      .notNullable()
      .references('id')
      .inTable('observations')
    table.integer('photo_id').unsigned().notNullable()
    table.primary(['observation_id', 'photo_id'])
    table.index(['photo_id'])
  })
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('observation_photos')
  await knex.schema.dropTable('observation_samples')
  await knex.schema.dropTable('observations')
}
