import type { Knex } from 'knex'

// The outbox: one row per message to one person, written in the transaction of the action that
// caused it; a sender delivers it later. Each try is kept. `received_mail` is the local SMTP
// server's mailbox (demo and tests), raw message kept.
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('outbox_messages', (table) => {
    table.increments('id')
    table.string('kind', 40).notNullable()
    table.integer('case_id').unsigned().nullable().index()
    table
      .integer('recipient_id')
      .unsigned()
      .nullable()
      .references('id')
      .inTable('users')
      .onDelete('SET NULL')
    table.string('to_address', 191).notNullable()
    table.string('to_name', 191).notNullable()
    table.string('subject', 400).notNullable()
    table.text('payload').notNullable()
    table.string('message_id', 191).notNullable().unique()
    table.enum('status', ['queued', 'sent', 'failed']).notNullable().defaultTo('queued')
    table.integer('attempts').unsigned().notNullable().defaultTo(0)
    table.dateTime('queued_at', { precision: 3 }).notNullable()
    table.dateTime('next_attempt_at', { precision: 3 }).nullable()
    table.dateTime('sent_at', { precision: 3 }).nullable()
    table.text('last_error').nullable()
    table.timestamps(true, true)
    table.index(['status', 'next_attempt_at'], 'outbox_messages_due')
  })
  await knex.schema.createTable('outbox_attempts', (table) => {
    table.increments('id')
    table
      .integer('outbox_message_id')
      .unsigned()
      .notNullable()
      .references('id')
      .inTable('outbox_messages')
      .onDelete('CASCADE')
    table.dateTime('attempted_at', { precision: 3 }).notNullable()
    table.enum('outcome', ['sent', 'failed']).notNullable()
    table.text('error').nullable()
  })
  await knex.schema.createTable('received_mail', (table) => {
    table.increments('id')
    table.string('message_id', 191).nullable().index()
    table.text('to_addresses').notNullable()
    table.text('subject').notNullable()
    table.text('text', 'mediumtext').notNullable()
    table.text('html', 'mediumtext').nullable()
    table.specificType('raw', 'mediumblob').notNullable()
    table.dateTime('received_at', { precision: 3 }).notNullable().index()
  })
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('received_mail')
  await knex.schema.dropTable('outbox_attempts')
  await knex.schema.dropTable('outbox_messages')
}
