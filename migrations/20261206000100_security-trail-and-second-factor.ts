import type { Knex } from 'knex'

// The security trail (sign-ins, refusals, changes of people) lives apart from the case activity;
// the application account may only add and read its rows (server/db/grants.ts).
export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('security_events', (table) => {
    table.bigIncrements('id')
    table.string('kind', 64).notNullable()
    // no foreign key: a row must outlive anything it names
    table.integer('actor_id').unsigned().nullable()
    table.string('email', 191).nullable()
    table.string('address', 64).nullable()
    table.string('user_agent', 512).nullable()
    table.json('details').nullable()
    table.timestamp('at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3))
    table.index(['kind', 'id'])
    table.index(['actor_id', 'id'])
  })
  await knex.schema.alterTable('users', (table) => {
    table.string('second_factor_secret', 64).nullable()
    table.dateTime('second_factor_enrolled_at').nullable()
    // the newest time step whose code was accepted: each code counts once
    table.bigInteger('second_factor_last_step').nullable()
    table.dateTime('one_time_password_expires_at').nullable()
  })
  await knex.schema.createTable('recovery_codes', (table) => {
    table.increments('id')
    table
      .integer('user_id')
      .unsigned()
      .notNullable()
      .references('id')
      .inTable('users')
      .onDelete('CASCADE')
    table.string('code_hash', 64).notNullable()
    table.dateTime('used_at').nullable()
    table.unique(['user_id', 'code_hash'])
  })
  await knex.schema.alterTable('organisations', (table) => {
    table.boolean('requires_second_factor').notNullable().defaultTo(false)
  })
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.alterTable('organisations', (table) => {
    table.dropColumn('requires_second_factor')
  })
  await knex.schema.dropTable('recovery_codes')
  await knex.schema.alterTable('users', (table) => {
    table.dropColumn('second_factor_secret')
    table.dropColumn('second_factor_enrolled_at')
    table.dropColumn('second_factor_last_step')
    table.dropColumn('one_time_password_expires_at')
  })
  await knex.schema.dropTable('security_events')
}
