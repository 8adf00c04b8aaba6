import type { Knex } from 'knex'

const KINDS = ['overall', 'macro', 'stereo', 'sem', 'metallographic', 'other']

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('photos', (table) => {
    table.increments('id')
    table
      .integer('case_id')
      .unsigned()
      .notNullable()
      .references('id')
      .inTable('cases')
      .onDelete('RESTRICT')
    // The sample the photo shows. No foreign key yet: the samples feature creates its table and
    // adds the key to samples.id in its own migration.
    table.integer('sample_id').unsigned().nullable()
    /** the original, byte for byte as received */
    table.string('original_key', 64).notNullable().unique()
    table.string('sha256', 64).notNullable()
    table.integer('size').unsigned().notNullable()
    table.string('media_type', 100).notNullable()
    /** the uploader's file name, shown to people only; never used on disk */
    table.string('file_name', 191).notNullable()
    /** upright (auto-oriented) size of the original in pixels */
    table.integer('width').unsigned().notNullable()
    table.integer('height').unsigned().notNullable()
    table.string('display_key', 64).notNullable().unique()
    table.string('display_sha256', 64).notNullable()
    table.integer('display_width').unsigned().notNullable()
    table.integer('display_height').unsigned().notNullable()
    table.string('thumbnail_key', 64).notNullable().unique()
    table.string('thumbnail_sha256', 64).notNullable()
    table.string('caption', 1000).nullable()
    table.enum('kind', KINDS).notNullable().defaultTo('other')
    table.decimal('magnification', 10, 2).nullable()
    table.string('taken_by', 191).nullable()
    table.date('taken_on').nullable()
    /** feature tags from the trade's vocabulary, a JSON array of keys */
    table.text('tags').notNullable()
    /** micrometres per pixel of the original and how it was found, JSON; null until calibrated */
    table.text('scale').nullable()
    /** arrows, circles, outlines and labels in original pixels, JSON */
    table.text('marks').notNullable()
    table.boolean('client_visible').notNullable().defaultTo(false)
    table.integer('version').unsigned().notNullable().defaultTo(1)
    table.integer('uploaded_by').unsigned().notNullable().references('id').inTable('users')
    table.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3))
    table.timestamp('updated_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3))
    table.index(['case_id', 'id'])
    table.index(['sample_id'])
  })
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('photos')
}
