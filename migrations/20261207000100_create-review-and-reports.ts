import type { Knex } from 'knex'

// An issued revision is sealed once its row hash is written: from then on the database itself
// refuses to change or remove it, and its figures can never be changed or removed.
const SEALED_REPORTS = `CREATE TRIGGER reports_sealed BEFORE UPDATE ON reports
FOR EACH ROW BEGIN
  IF OLD.row_sha256 <> '' THEN
    SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'issued report revisions are immutable';
  END IF;
END`
const KEEP_REPORTS = `CREATE TRIGGER reports_kept BEFORE DELETE ON reports
FOR EACH ROW SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'issued report revisions are immutable'`
const FIXED_FIGURES = `CREATE TRIGGER report_figures_fixed BEFORE UPDATE ON report_figures
FOR EACH ROW SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'issued report figures are immutable'`
const KEEP_FIGURES = `CREATE TRIGGER report_figures_kept BEFORE DELETE ON report_figures
FOR EACH ROW SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'issued report figures are immutable'`

const caseId = (table: Knex.CreateTableBuilder) =>
  table.integer('case_id').unsigned().notNullable().references('id').inTable('cases')
const personId = (table: Knex.CreateTableBuilder, name: string, nullable = false) => {
  const column = table.integer(name).unsigned().references('id').inTable('users')
  return nullable ? column.nullable() : column.notNullable()
}

async function createReviewTables(knex: Knex) {
  // Threaded, anchored to a section (its key) or a passage (the quoted text), resolvable, kept.
  await knex.schema.createTable('review_comments', (table) => {
    table.increments('id')
    caseId(table)
    table.integer('parent_id').unsigned().nullable().references('id').inTable('review_comments')
    personId(table, 'author_id')
    table.string('section_key', 40).nullable()
    table.text('quote').nullable()
    table.text('body').notNullable()
    table.timestamp('resolved_at', { precision: 3 }).nullable()
    personId(table, 'resolved_by', true)
    table.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3))
    table.index(['case_id', 'id'])
  })
  // What the reviewer approved: the SHA-256 of the exact content, until an edit withdraws it.
  await knex.schema.createTable('approvals', (table) => {
    table.increments('id')
    caseId(table)
    personId(table, 'approver_id')
    table.timestamp('approved_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3))
    table.specificType('content_sha256', 'CHAR(64)').notNullable()
    table.timestamp('withdrawn_at', { precision: 3 }).nullable()
    personId(table, 'withdrawn_by', true)
    table.integer('report_id').unsigned().nullable()
    table.index(['case_id', 'id'])
  })
  // An amendment under way: the revision it replaces and why (ISO/IEC 17025 7.8.8).
  await knex.schema.createTable('amendments', (table) => {
    table.increments('id')
    caseId(table)
    table.integer('replaces_report_id').unsigned().notNullable()
    table.text('reason').notNullable()
    personId(table, 'requested_by')
    table.timestamp('created_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3))
    table.integer('report_id').unsigned().nullable()
    table.index(['case_id', 'id'])
  })
}

async function createReportTables(knex: Knex) {
  await knex.schema.createTable('reports', (table) => {
    table.increments('id')
    caseId(table)
    table.string('number', 64).notNullable()
    table.string('revision', 4).notNullable()
    table.integer('replaces_report_id').unsigned().nullable().references('id').inTable('reports')
    table.text('amendment_reason').nullable()
    table.specificType('doc', 'LONGTEXT').notNullable()
    table.specificType('html', 'LONGTEXT').notNullable()
    table.specificType('live_blocks', 'LONGTEXT').notNullable()
    table.specificType('content_sha256', 'CHAR(64)').notNullable()
    personId(table, 'approved_by')
    table.timestamp('approved_at', { precision: 3 }).notNullable()
    personId(table, 'issued_by')
    table.timestamp('issued_at', { precision: 3 }).notNullable()
    // SHA-256 of the whole revision as stored (content, figures, who and when); '' until sealed
    table.specificType('row_sha256', 'CHAR(64)').notNullable().defaultTo('')
    table.unique(['case_id', 'revision'])
  })
  await knex.schema.createTable('report_figures', (table) => {
    table.increments('id')
    table.integer('report_id').unsigned().notNullable().references('id').inTable('reports')
    table.string('figure_id', 64).notNullable()
    table.integer('photo_id').unsigned().notNullable().references('id').inTable('photos')
    table.string('storage_key', 191).notNullable()
    table.specificType('sha256', 'CHAR(64)').notNullable()
    table.integer('size').unsigned().notNullable()
    table.unique(['report_id', 'figure_id'])
  })
  await knex.schema.createTable('report_acknowledgements', (table) => {
    table.integer('report_id').unsigned().notNullable().references('id').inTable('reports')
    personId(table, 'person_id')
    table.timestamp('acknowledged_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3))
    table.primary(['report_id', 'person_id'])
  })
  await knex.schema.createTable('report_questions', (table) => {
    table.increments('id')
    table.integer('report_id').unsigned().notNullable().references('id').inTable('reports')
    personId(table, 'asked_by')
    table.text('body').notNullable()
    table.timestamp('asked_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3))
  })
  await knex.schema.createTable('report_answers', (table) => {
    table.increments('id')
    table
      .integer('question_id')
      .unsigned()
      .notNullable()
      .references('id')
      .inTable('report_questions')
    personId(table, 'answered_by')
    table.text('body').notNullable()
    table.timestamp('answered_at', { precision: 3 }).notNullable().defaultTo(knex.fn.now(3))
  })
}

export async function up(knex: Knex): Promise<void> {
  await createReviewTables(knex)
  await createReportTables(knex)
  for (const trigger of [SEALED_REPORTS, KEEP_REPORTS, FIXED_FIGURES, KEEP_FIGURES])
    await knex.raw(trigger)
}

export async function down(knex: Knex): Promise<void> {
  for (const name of [
    'reports_sealed',
    'reports_kept',
    'report_figures_fixed',
    'report_figures_kept',
  ])
    await knex.raw(`DROP TRIGGER IF EXISTS ${name}`)
  for (const table of [
    'report_answers',
    'report_questions',
    'report_acknowledgements',
    'report_figures',
    'reports',
    'amendments',
    'approvals',
    'review_comments',
  ])
    await knex.schema.dropTable(table)
}
