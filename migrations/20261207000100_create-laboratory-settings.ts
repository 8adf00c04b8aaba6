import type { Knex } from 'knex'

export async function up(knex: Knex): Promise<void> {
  // The laboratory's own particulars, printed on every report: one row, id 1.
  await knex.schema.createTable('laboratory_settings', (table) => {
    table.integer('id').unsigned().primary()
    table.string('name', 191).notNullable()
    // the postal address, one line per array entry (JSON text)
    table.text('address_lines').notNullable()
    table.integer('updated_by').unsigned().nullable().references('id').inTable('users')
    table.timestamp('updated_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3))
  })
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('laboratory_settings')
}
