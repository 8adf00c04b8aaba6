import type { Knex } from 'knex'
import QRCode from 'qrcode'
import type { SecondFactorEnrolment } from '../../shared/schemas/auth'
import { Conflict, ValidationError } from '../errors'
import {
  matchingStep,
  newRecoveryCodes,
  newTotpSecret,
  recoveryCodeHash,
  totpUri,
} from '../auth/totp'
import { recordSecurityEvent, type SecurityContext } from './security-events'

interface SecondFactorRow {
  email: string
  secondFactorSecret: string | null
  secondFactorEnrolledAt: Date | null
}

const WRONG_CODE = 'The code is not correct. Enter the current code from your authenticator app.'

async function rowOf(db: Knex, userId: number): Promise<SecondFactorRow | undefined> {
  return (await db('users')
    .where({ id: userId })
    .first('email', 'secondFactorSecret', 'secondFactorEnrolledAt')) as SecondFactorRow | undefined
}

/**
 * Accepts a code once: the step is stored only when it is newer than the last one accepted, in a
 * single UPDATE, so two requests with the same code cannot both pass.
 */
async function claimStep(db: Knex, userId: number, step: number): Promise<boolean> {
  const changed = await db('users')
    .where({ id: userId })
    .where((query) =>
      query.whereNull('secondFactorLastStep').orWhere('secondFactorLastStep', '<', step),
    )
    .update({ secondFactorLastStep: step })
  return changed === 1
}

export function createSecondFactorService(db: Knex) {
  /** A new key for the person to add to their authenticator app; kept by the caller's session. */
  async function begin(userId: number): Promise<SecondFactorEnrolment> {
    const row = await rowOf(db, userId)
    if (!row) throw new ValidationError('No such person.')
    if (row.secondFactorEnrolledAt) {
      throw new Conflict('Two-factor sign-in is already set up. An administrator can reset it.')
    }
    const secret = newTotpSecret()
    const uri = totpUri(secret, row.email)
    const qrCode = await QRCode.toDataURL(uri, { errorCorrectionLevel: 'M', margin: 2, width: 240 })
    return { secret, uri, qrCode }
  }

  /** Stores the key once the first code proves the app has it; answers the recovery codes. */
  async function confirm(
    trail: SecurityContext & { actorId: number },
    secret: string,
    code: string,
  ): Promise<string[]> {
    const step = matchingStep(secret, code)
    if (step === undefined) {
      throw new ValidationError(WRONG_CODE, [{ path: 'code', message: WRONG_CODE }])
    }
    const codes = newRecoveryCodes()
    const userId = trail.actorId
    await db.transaction(async (trx) => {
      const enrolled = await trx('users')
        .where({ id: userId })
        .whereNull('secondFactorEnrolledAt')
        .update({
          secondFactorSecret: secret,
          secondFactorEnrolledAt: new Date(),
          secondFactorLastStep: step,
        })
      if (enrolled !== 1) throw new Conflict('Two-factor sign-in is already set up.')
      await trx('recovery_codes').where({ userId }).delete()
      await trx('recovery_codes').insert(
        codes.map((recovery) => ({ userId, codeHash: recoveryCodeHash(recovery) })),
      )
      await recordSecurityEvent(trx, trail, { kind: 'second_factor.enrolled' })
    })
    return codes
  }

  /** True when the code is the person's current one and has not been used before. */
  async function verifyCode(userId: number, code: string): Promise<boolean> {
    const row = await rowOf(db, userId)
    if (!row?.secondFactorSecret || !row.secondFactorEnrolledAt) return false
    const step = matchingStep(row.secondFactorSecret, code)
    return step !== undefined && (await claimStep(db, userId, step))
  }

  /** True when the recovery code is one of the person's unused ones; it is then used up. */
  async function useRecoveryCode(userId: number, code: string): Promise<boolean> {
    const used = await db('recovery_codes')
      .where({ userId, codeHash: recoveryCodeHash(code) })
      .whereNull('usedAt')
      .update({ usedAt: new Date() })
    return used === 1
  }

  /** An administrator removes a person's second factor; they set up a new one at next sign-in. */
  async function reset(trail: SecurityContext, userId: number): Promise<void> {
    await db.transaction(async (trx) => {
      const row = await rowOf(trx, userId)
      await trx('users').where({ id: userId }).update({
        secondFactorSecret: null,
        secondFactorEnrolledAt: null,
        secondFactorLastStep: null,
      })
      await trx('recovery_codes').where({ userId }).delete()
      const details = { personId: userId }
      await recordSecurityEvent(trx, trail, {
        kind: 'second_factor.removed',
        email: row?.email ?? null,
        details,
      })
    })
  }

  async function isEnrolled(userId: number): Promise<boolean> {
    return Boolean((await rowOf(db, userId))?.secondFactorEnrolledAt)
  }

  return { begin, confirm, verifyCode, useRecoveryCode, reset, isEnrolled }
}

export type SecondFactorService = ReturnType<typeof createSecondFactorService>
