import type { Knex } from 'knex'

const CUT_METHODS = ['saw', 'abrasive', 'wire_edm', 'other']
const CUSTODY_KINDS = [
  'received',
  'transferred',
  'sectioned',
  'sent_out',
  'returned',
  'returned_to_client',
  'disposed',
]

// Custody is append-only (ASTM E1188): the database itself refuses to change or remove an event,
// so no code path, present or future, can rewrite the chain. A correction is a new event.
const REFUSE_UPDATE = `CREATE TRIGGER custody_events_no_update BEFORE UPDATE ON custody_events
FOR EACH ROW SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'custody events are append-only'`
const REFUSE_DELETE = `CREATE TRIGGER custody_events_no_delete BEFORE DELETE ON custody_events
FOR EACH ROW SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'custody events are append-only'`

export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('cases', (table) => {
    table.integer('notice_period_days').unsigned().notNullable().defaultTo(10)
  })
  await knex.schema.createTable('samples', (table) => {
    table.increments('id')
    table
      .integer('case_id')
      .unsigned()
      .notNullable()
      .references('id')
      .inTable('cases')
      .onDelete('RESTRICT')
    table
      .integer('parent_id')
      .unsigned()
      .nullable()
      .references('id')
      .inTable('samples')
      .onDelete('RESTRICT')
    /** the item's place among its siblings: S<n> at the top, <parent>.<n> below */
    table.integer('position').unsigned().notNullable()
    table.string('item_id', 100).notNullable()
    table.text('description').notNullable()
    table.string('received_from', 191).notNullable()
    table.date('received_on').notNullable()
    table.string('collected_by', 191).nullable()
    table.text('condition').nullable()
    table.string('packaging', 191).nullable()
    table.string('storage_location', 191).nullable()
    table.string('cut_location', 191).nullable()
    table.string('orientation', 191).nullable()
    table.enum('cut_method', CUT_METHODS).nullable()
    table.boolean('client_visible').notNullable().defaultTo(false)
    table.integer('created_by').unsigned().notNullable().references('id').inTable('users')
    table.timestamps(true, true)
    table.unique(['case_id', 'item_id'])
    table.index(['parent_id'])
  })
  await knex.schema.createTable('custody_events', (table) => {
    table.increments('id')
    table.integer('case_id').unsigned().notNullable().references('id').inTable('cases')
    table.integer('sample_id').unsigned().notNullable().references('id').inTable('samples')
    table.enum('kind', CUSTODY_KINDS).notNullable()
    table.string('from_party', 191).notNullable()
    table.string('to_party', 191).notNullable()
    table.datetime('at').notNullable()
    table.text('purpose').nullable()
    table.text('condition').nullable()
    table.string('location', 191).nullable()
    table.integer('corrects_id').unsigned().nullable().references('id').inTable('custody_events')
    table.integer('entered_by').unsigned().notNullable().references('id').inTable('users')
    table.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3))
    table.index(['sample_id', 'at'])
  })
  await knex.raw(REFUSE_UPDATE)
  await knex.raw(REFUSE_DELETE)
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw('DROP TRIGGER IF EXISTS custody_events_no_delete')
  await knex.raw('DROP TRIGGER IF EXISTS custody_events_no_update')
  await knex.schema.dropTable('custody_events')
  await knex.schema.dropTable('samples')
  await knex.schema.alterTable('cases', (table) => {
    table.dropColumn('notice_period_days')
  })
}
