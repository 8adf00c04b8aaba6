import type { Knex } from 'knex'

const FIXED = `CREATE TRIGGER report_pdfs_fixed BEFORE UPDATE ON report_pdfs
FOR EACH ROW SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'issued report PDFs are immutable'`
const KEPT = `CREATE TRIGGER report_pdfs_kept BEFORE DELETE ON report_pdfs
FOR EACH ROW SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'issued report PDFs are immutable'`

export async function up(knex: Knex): Promise<void> {
  // The PDF of an issued revision: made once at issue, served as stored, checked by its hash.
  await knex.schema.createTable('report_pdfs', (table) => {
    table.integer('report_id').unsigned().primary().references('id').inTable('reports')
    table.string('storage_key', 191).notNullable()
    table.string('sha256', 64).notNullable()
    table.integer('size').unsigned().notNullable()
    table.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3))
  })
  await knex.raw(FIXED)
  await knex.raw(KEPT)
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw('DROP TRIGGER IF EXISTS report_pdfs_kept')
  await knex.raw('DROP TRIGGER IF EXISTS report_pdfs_fixed')
  await knex.schema.dropTable('report_pdfs')
}
