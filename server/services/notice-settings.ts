import type { Knex } from 'knex'
import { isStaff, type Actor } from '../../shared/access/policy'
import {
  isEssentialNotice,
  NOTICE_AUDIENCE,
  NOTICE_KIND_LABELS,
  PERSONAL_NOTICE_KINDS,
  type NoticeSetting,
  type NoticeSettingsUpdate,
} from '../../shared/schemas/notice-settings'
import type { ServiceContext } from './context'

/** The kinds a person can receive: clients' notices for clients, the case's work for staff. */
function kindsFor(actor: Actor) {
  const client = actor.roles.includes('client')
  const staff = isStaff(actor)
  return PERSONAL_NOTICE_KINDS.filter((kind) =>
    NOTICE_AUDIENCE[kind] === 'client' ? client : staff,
  )
}

async function turnedOff(db: Knex, userId: number): Promise<Set<string>> {
  const rows = (await db('notice_opt_outs').where({ userId }).select('kind')) as { kind: string }[]
  return new Set(rows.map((row) => row.kind))
}

/** The signed-in person's notices, each on or off. */
export async function readNoticeSettings({ actor, db }: ServiceContext): Promise<NoticeSetting[]> {
  const off = await turnedOff(db, actor.id)
  return kindsFor(actor).map((kind) => ({
    kind,
    label: NOTICE_KIND_LABELS[kind],
    essential: isEssentialNotice(kind),
    on: isEssentialNotice(kind) || !off.has(kind),
  }))
}

/** Replaces the person's choices: exactly the kinds in `off` are turned off. */
export async function saveNoticeSettings(
  ctx: ServiceContext,
  input: NoticeSettingsUpdate,
): Promise<NoticeSetting[]> {
  const off = [...new Set(input.off)]
  await ctx.db.transaction(async (trx) => {
    await trx('notice_opt_outs').where({ userId: ctx.actor.id }).delete()
    if (off.length > 0) {
      await trx('notice_opt_outs').insert(off.map((kind) => ({ userId: ctx.actor.id, kind })))
    }
  })
  return readNoticeSettings(ctx)
}

/** Of `personIds`, those who turned this kind of notice off (never for an essential kind). */
export async function optedOut(db: Knex, kind: string, personIds: number[]): Promise<Set<number>> {
  if (isEssentialNotice(kind) || personIds.length === 0) return new Set()
  const rows = (await db('notice_opt_outs')
    .where({ kind })
    .whereIn('userId', personIds)
    .select('userId')) as { userId: number }[]
  return new Set(rows.map((row) => row.userId))
}
