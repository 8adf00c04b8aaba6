import type { Knex } from 'knex'

// Reports leave the lab "issued" (ISO/IEC 17025 wording), not "released".
const BEFORE = ['intake', 'examination', 'drafting', 'in_review', 'revisions_requested', 'approved']
const AFTER = ['closed']

async function renameState(knex: Knex, from: string, to: string): Promise<void> {
  const both = [...BEFORE, from, to, ...AFTER].map((state) => `'${state}'`).join(', ')
  const only = [...BEFORE, to, ...AFTER].map((state) => `'${state}'`).join(', ')
  await knex.raw(`ALTER TABLE cases MODIFY status ENUM(${both}) NOT NULL DEFAULT 'intake'`)
  await knex('cases').where({ status: from }).update({ status: to })
  await knex.raw(`ALTER TABLE cases MODIFY status ENUM(${only}) NOT NULL DEFAULT 'intake'`)
}

export async function up(knex: Knex): Promise<void> {
  await renameState(knex, 'released', 'issued')
}

export async function down(knex: Knex): Promise<void> {
  await renameState(knex, 'issued', 'released')
}
