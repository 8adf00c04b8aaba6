import type { Knex } from 'knex'
import type { SectionKey } from '../../../shared/findings/sections'
import type { ReviewComment, ReviewCommentCreate } from '../../../shared/schemas/review'
import { NotFound, ValidationError } from '../../errors'
import { recordAudit } from '../audit'
import type { ServiceContext } from '../context'

interface CommentRow {
  id: number
  parentId: number | null
  authorId: number
  authorName: string
  sectionKey: SectionKey | null
  quote: string | null
  body: string
  createdAt: Date
  resolvedAt: Date | null
  resolvedByName: string | null
}

const toComment = (row: CommentRow): ReviewComment => ({
  ...row,
  createdAt: row.createdAt.toISOString(),
  resolvedAt: row.resolvedAt?.toISOString() ?? null,
})

function commentsOf(db: Knex, caseId: number) {
  return db('review_comments as c')
    .join('users as a', 'a.id', 'c.authorId')
    .leftJoin('users as r', 'r.id', 'c.resolvedBy')
    .where('c.caseId', caseId)
    .select('c.*', 'a.name as authorName', 'r.name as resolvedByName')
}

/** The review conversation of a case, oldest first; replies follow their thread by `parentId`. */
export async function listComments(db: Knex, caseId: number): Promise<ReviewComment[]> {
  return ((await commentsOf(db, caseId).orderBy('c.id')) as CommentRow[]).map(toComment)
}

async function findComment(db: Knex, caseId: number, id: number): Promise<CommentRow> {
  const row = (await commentsOf(db, caseId).where('c.id', id).first()) as CommentRow | undefined
  if (!row) throw new NotFound('No such comment on this case.')
  return row
}

/** A new comment, or a reply that takes the anchor of the thread it answers. */
export async function addComment(
  { actor, db }: ServiceContext,
  caseId: number,
  input: ReviewCommentCreate,
): Promise<ReviewComment> {
  const id = await db.transaction(async (trx) => {
    let anchor = { sectionKey: input.sectionKey ?? null, quote: input.quote ?? null }
    let parentId: number | null = null
    if (input.parentId) {
      const parent = await findComment(trx, caseId, input.parentId).catch(() => {
        const message = 'Reply to a comment of this case.'
        throw new ValidationError(message, [{ path: 'parentId', message }])
      })
      parentId = parent.parentId ?? parent.id
      anchor = { sectionKey: parent.sectionKey, quote: parent.quote }
    }
    const [newId] = (await trx('review_comments').insert({
      caseId,
      parentId,
      authorId: actor.id,
      ...anchor,
      body: input.body,
    })) as number[]
    const details = { commentId: newId, sectionKey: anchor.sectionKey, reply: parentId !== null }
    await recordAudit(trx, { caseId, actorId: actor.id, kind: 'review.commented', details })
    return newId as number
  })
  return toComment(await findComment(db, caseId, id))
}

/** Marks a thread resolved (its first comment); the comments stay in the record. */
export async function resolveComment(
  { actor, db }: ServiceContext,
  caseId: number,
  commentId: number,
): Promise<ReviewComment> {
  await db.transaction(async (trx) => {
    const comment = await findComment(trx, caseId, commentId)
    const threadId = comment.parentId ?? comment.id
    const thread = await findComment(trx, caseId, threadId)
    if (thread.resolvedAt) return
    await trx('review_comments')
      .where({ id: threadId })
      .update({ resolvedAt: trx.fn.now(3), resolvedBy: actor.id })
    const details = { commentId: threadId }
    await recordAudit(trx, { caseId, actorId: actor.id, kind: 'review.comment_resolved', details })
  })
  return toComment(await findComment(db, caseId, commentId))
}
