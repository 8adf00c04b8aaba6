import type { Knex } from 'knex'

/** A case's material linked to a record of the specification library and one of its size bands. */
export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('cases', (table) => {
    table
      .integer('specification_id')
      .unsigned()
      .nullable()
      .references('id')
      .inTable('specifications')
      .onDelete('RESTRICT')
    /** index into the record's bands (counted from 0) */
    table.tinyint('specification_band').unsigned().nullable()
    /** the part's governing section size, mm: what the band was chosen by */
    table.decimal('section_size_mm', 9, 2).nullable()
  })
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('cases', (table) => {
    table.dropForeign(['specification_id'])
    table.dropColumn('specification_id')
    table.dropColumn('specification_band')
    table.dropColumn('section_size_mm')
  })
}
