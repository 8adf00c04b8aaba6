import type { Knex } from 'knex'

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('organisations', (table) => {
    table.increments('id')
    table.string('name', 191).notNullable().unique()
    table.string('contact_name', 191).nullable()
    table.string('contact_email', 191).nullable()
    table.boolean('active').notNullable().defaultTo(true)
    table.timestamps(true, true)
  })
  await knex.schema.createTable('users', (table) => {
    table.increments('id')
    table.string('email', 191).notNullable().unique()
    table.string('name', 191).notNullable()
    table.string('password_hash', 255).notNullable()
    table.boolean('must_change_password').notNullable().defaultTo(true)
    table.boolean('active').notNullable().defaultTo(true)
    table
      .integer('organisation_id')
      .unsigned()
      .nullable()
      .references('id')
      .inTable('organisations')
      .onDelete('RESTRICT')
    table.dateTime('last_sign_in_at').nullable()
    table.timestamps(true, true)
  })
  await knex.schema.createTable('user_roles', (table) => {
    table
      .integer('user_id')
      .unsigned()
      .notNullable()
      .references('id')
      .inTable('users')
      .onDelete('CASCADE')
    table.enum('role', ['admin', 'investigator', 'lab', 'reviewer', 'client']).notNullable()
    table.primary(['user_id', 'role'])
  })
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTable('user_roles')
  await knex.schema.dropTable('users')
  await knex.schema.dropTable('organisations')
}
