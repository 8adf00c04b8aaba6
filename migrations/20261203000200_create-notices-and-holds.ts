import type { Knex } from 'knex'

const caseColumn = (table: Knex.CreateTableBuilder) =>
  table
    .integer('case_id')
    .unsigned()
    .notNullable()
    .references('id')
    .inTable('cases')
    .onDelete('RESTRICT')

export async function up(knex: Knex): Promise<void> {
  // Notice before destructive testing (ASTM E860): what is planned, when, for which items, who
  // authorised it, and the date by which parties may attend or object.
  await knex.schema.createTable('notices', (table) => {
    table.increments('id')
    caseColumn(table)
    table.text('planned_work').notNullable()
    table.date('planned_on').notNullable()
    table.date('sent_on').notNullable()
    table.date('respond_by').notNullable()
    table.string('authorised_by', 191).notNullable()
    table.integer('recorded_by').unsigned().notNullable().references('id').inTable('users')
    table.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3))
  })
  await knex.schema.createTable('notice_samples', (table) => {
    table.integer('notice_id').unsigned().notNullable().references('id').inTable('notices')
    table.integer('sample_id').unsigned().notNullable().references('id').inTable('samples')
    table.primary(['notice_id', 'sample_id'])
    table.index(['sample_id'])
  })
  // The parties as named on the case when the notice went out: later edits of the case do not
  // change who was notified.
  await knex.schema.createTable('notice_parties', (table) => {
    table.increments('id')
    table.integer('notice_id').unsigned().notNullable().references('id').inTable('notices')
    table.string('name', 191).notNullable()
    table.string('organisation', 191).nullable()
    table.string('email', 191).nullable()
    table.string('role', 40).notNullable()
  })
  await knex.schema.createTable('notice_answers', (table) => {
    table.increments('id')
    table.integer('notice_id').unsigned().notNullable().references('id').inTable('notices')
    table.integer('party_id').unsigned().notNullable().references('id').inTable('notice_parties')
    table.enum('answer', ['agreed', 'will_attend', 'objected']).notNullable()
    table.text('comment').nullable()
    table.date('answered_on').notNullable()
    table.integer('recorded_by').unsigned().notNullable().references('id').inTable('users')
    table.text('resolution').nullable()
    table.integer('resolved_by').unsigned().nullable().references('id').inTable('users')
    table.timestamp('resolved_at', { precision: 3 }).nullable()
    table.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3))
    table.index(['notice_id', 'party_id'])
  })
  await knex.schema.createTable('legal_holds', (table) => {
    table.increments('id')
    caseColumn(table)
    /** null: the hold covers the whole case */
    table.integer('sample_id').unsigned().nullable().references('id').inTable('samples')
    table.text('reason').notNullable()
    table.integer('placed_by').unsigned().notNullable().references('id').inTable('users')
    table.timestamp('placed_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3))
    table.text('release_reason').nullable()
    table.integer('released_by').unsigned().nullable().references('id').inTable('users')
    table.timestamp('released_at', { precision: 3 }).nullable()
    table.index(['case_id', 'released_at'])
  })
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('legal_holds')
  await knex.schema.dropTable('notice_answers')
  await knex.schema.dropTable('notice_parties')
  await knex.schema.dropTable('notice_samples')
  await knex.schema.dropTable('notices')
}
