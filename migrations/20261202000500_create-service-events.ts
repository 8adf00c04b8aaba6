import type { Knex } from 'knex'

const KINDS = [
  'manufacture',
  'installation',
  'inspection',
  'repair',
  'modification',
  'incident',
  'environment_change',
  'failure',
  'other',
]

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('service_events', (table) => {
    table.increments('id')
    table
      .integer('case_id')
      .unsigned()
      .notNullable()
      .references('id')
      .inTable('cases')
      .onDelete('RESTRICT')
    table.enum('kind', KINDS).notNullable()
    table.date('occurred_on').notNullable()
    table.text('description').notNullable()
    table.decimal('hours', 12, 1).nullable()
    table.bigInteger('cycles').unsigned().nullable()
    table.decimal('temperature_c', 7, 1).nullable()
    table.string('environment', 191).nullable()
    table.string('load', 191).nullable()
    table.string('source', 191).nullable()
    table.boolean('client_visible').notNullable().defaultTo(false)
    table.integer('version').unsigned().notNullable().defaultTo(1)
    table.integer('created_by').unsigned().notNullable().references('id').inTable('users')
    table.timestamps(true, true)
    table.index(['case_id', 'occurred_on'])
  })
  await knex.schema.createTable('attachments', (table) => {
    table.increments('id')
    table
      .integer('case_id')
      .unsigned()
      .notNullable()
      .references('id')
      .inTable('cases')
      .onDelete('RESTRICT')
    table
      .integer('service_event_id')
      .unsigned()
      .nullable()
      .references('id')
      .inTable('service_events')
      .onDelete('RESTRICT')
    table.string('storage_key', 64).notNullable().unique()
    table.string('sha256', 64).notNullable()
    table.integer('size').unsigned().notNullable()
    table.string('media_type', 100).notNullable()
    /** the uploader's file name, shown to people only; never used on disk */
    table.string('file_name', 191).notNullable()
    table.integer('uploaded_by').unsigned().notNullable().references('id').inTable('users')
    table.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3))
    table.index(['service_event_id'])
  })
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('attachments')
  await knex.schema.dropTable('service_events')
}
