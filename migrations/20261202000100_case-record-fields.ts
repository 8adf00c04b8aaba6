import type { Knex } from 'knex'

const MECHANISM_AND_PARTY_NOTE = 'JSON arrays, checked by the API schema'

export async function up(knex: Knex): Promise<void> {
  await knex.schema.alterTable('cases', (table) => {
    table.string('contact_name', 191).nullable()
    table.string('contact_email', 191).nullable()
    table.string('client_reference', 100).nullable()
    table.text('component_description').nullable()
    table.string('component_function', 1000).nullable()
    table.string('heat_or_lot', 100).nullable()
    table.date('received_on').nullable()
    table.string('failure_location', 191).nullable()
    table.text('how_found').nullable()
    table.text('scope').nullable()
    table.enum('decision_rule', ['simple', 'guard_band']).notNullable().defaultTo('simple')
    table.boolean('safety_critical').notNullable().defaultTo(false)
    table
      .integer('lab_technician_id')
      .unsigned()
      .nullable()
      .references('id')
      .inTable('users')
      .onDelete('RESTRICT')
    table
      .integer('reviewer_id')
      .unsigned()
      .nullable()
      .references('id')
      .inTable('users')
      .onDelete('RESTRICT')
    table.json('mechanisms').nullable().comment(MECHANISM_AND_PARTY_NOTE)
    table
      .enum('root_cause', [
        'design',
        'material',
        'manufacturing',
        'assembly',
        'service',
        'maintenance',
        'environment',
        'undetermined',
      ])
      .nullable()
    table.json('interested_parties').nullable().comment(MECHANISM_AND_PARTY_NOTE)
    table.integer('version').unsigned().notNullable().defaultTo(1)
  })
  await knex.schema.createTable('case_co_investigators', (table) => {
    table
      .integer('case_id')
      .unsigned()
      .notNullable()
      .references('id')
      .inTable('cases')
      .onDelete('CASCADE')
    table
      .integer('user_id')
      .unsigned()
      .notNullable()
      .references('id')
      .inTable('users')
      .onDelete('RESTRICT')
    table.primary(['case_id', 'user_id'])
    table.index(['user_id'])
  })
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('case_co_investigators')
  await knex.schema.alterTable('cases', (table) => {
    table.dropForeign(['lab_technician_id'])
    table.dropForeign(['reviewer_id'])
  })
  await knex.schema.alterTable('cases', (table) => {
    table.dropColumns(
      'contact_name',
      'contact_email',
      'client_reference',
      'component_description',
      'component_function',
      'heat_or_lot',
      'received_on',
      'failure_location',
      'how_found',
      'scope',
      'decision_rule',
      'safety_critical',
      'lab_technician_id',
      'reviewer_id',
      'mechanisms',
      'root_cause',
      'interested_parties',
      'version',
    )
  })
}
