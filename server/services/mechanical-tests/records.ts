import { createReadStream } from 'node:fs'
import { fileTypeFromBuffer, fileTypeFromFile } from 'file-type'
import type { Knex } from 'knex'
import type {
  TensileRecordInvalidate,
  TensileRecordRecompute,
  TensileRecordView,
} from '../../../shared/schemas/mechanical-tests'
import type { SpecimenResult, TensileOptions } from '../../../shared/tensile'
import { AppError, Conflict, Forbidden, NotFound, ValidationError } from '../../errors'
import type { FileStorage } from '../../storage/file-storage'
import {
  checkedOptions,
  tensileRefusal,
  type TensileAnalyser,
  type UploadSource,
} from '../../tensile/analyse-upload'
import { recordAudit } from '../audit'
import type { ServiceContext } from '../context'
import { judgeAgainstLink } from '../../../shared/specifications/case-conformity'
import { loadCaseMaterial } from './material-link'
import { toRecordView, type RecordRow } from './rows'
import { findSpecimen } from './specimens'

export interface RecordDeps {
  storage: FileStorage
  analyse: TensileAnalyser
}

/** A safe name to show and to put in the result's `file`: no path, no control characters. */
export function displayName(original: string): string {
  const base = original.split(/[\\/]/).pop() ?? ''
  const clean = base.replace(/[\p{Cc}\p{Cf}"]/gu, '').trim()
  return (clean || 'record').slice(0, 191)
}

/** The options field of the upload: a JSON object in the engine's options contract. */
export function optionsFromField(field: unknown): TensileOptions {
  if (field === undefined || field === '') return checkedOptions({})
  let parsed: unknown
  try {
    parsed = JSON.parse(String(field))
  } catch {
    throw new ValidationError('The field "options" must be a JSON object.')
  }
  if (parsed === null || typeof parsed !== 'object' || Array.isArray(parsed))
    throw new ValidationError('The field "options" must be a JSON object.')
  return checkedOptions(parsed)
}

/** An upload held in memory, or waiting in a temporary file (the API's way: never whole in memory). */
export type UploadedRecord = { originalname: string } & ({ buffer: Buffer } | { path: string })

/** Whether a file holds a NUL byte, read in chunks so no step holds the thread for long. */
async function fileHasNul(path: string): Promise<boolean> {
  for await (const chunk of createReadStream(path, { highWaterMark: 1 << 20 }))
    if ((chunk as Buffer).includes(0)) return true
  return false
}

/** A testing machine's export is text: anything with a binary signature or NUL bytes is not. */
async function checkIsText(file: UploadedRecord): Promise<void> {
  const found =
    'buffer' in file ? await fileTypeFromBuffer(file.buffer) : await fileTypeFromFile(file.path)
  const nul = 'buffer' in file ? file.buffer.includes(0) : await fileHasNul(file.path)
  if (found || nul)
    throw new AppError(
      'unsupported_file_type',
      'A raw record must be the testing machine’s text export (CSV, TSV or TXT).',
      { detected: found?.mime ?? 'binary' },
    )
}

export async function findRecord(db: Knex, caseId: number, recordId: number, forUpdate = false) {
  const query = db('tensile_records').where({ id: recordId, caseId })
  if (forUpdate) query.forUpdate()
  const row = (await query.first()) as RecordRow | undefined
  if (!row) throw new NotFound('No such tensile record in this case.')
  return row
}

function checkVersion(row: RecordRow, version: number): void {
  if (row.version !== version)
    throw new AppError(
      'version_conflict',
      'Someone else changed this record after you opened it. Nothing was saved.',
      { current: toRecordView(row) },
    )
}

async function analyse(
  deps: RecordDeps,
  name: string,
  source: UploadSource,
  options: TensileOptions,
) {
  try {
    return await deps.analyse(name, source, options)
  } catch (error) {
    tensileRefusal(error)
  }
}

/** Key values for the activity trail of a recomputation: what was used and what came out. */
function outline(options: TensileOptions, result: SpecimenResult) {
  return {
    options,
    modulusGPa: result.modulusGPa,
    modulusFit: { fromMPa: result.modulusFit.fromMPa, toMPa: result.modulusFit.toMPa },
    yieldStrengthMPa: result.yieldStrengthMPa,
    tensileStrengthMPa: result.tensileStrengthMPa,
  }
}

export async function uploadRecord(
  deps: RecordDeps,
  { actor, db }: ServiceContext,
  ids: { caseId: number; specimenId: number },
  file: UploadedRecord,
  optionsField: unknown,
) {
  const { caseId, specimenId } = ids
  await findSpecimen(db, caseId, specimenId)
  const options = optionsFromField(optionsField)
  await checkIsText(file)
  const fileName = displayName(file.originalname)
  const source = 'buffer' in file ? file.buffer : { path: file.path }
  const result = await analyse(deps, fileName, source, options)
  const stored =
    'buffer' in file ? await deps.storage.put(file.buffer) : await deps.storage.putFile(file.path)
  try {
    const id = await db.transaction(async (trx) => {
      await findSpecimen(trx, caseId, specimenId)
      const [newId] = (await trx('tensile_records').insert({
        caseId,
        specimenId,
        storageKey: stored.key,
        sha256: stored.sha256,
        size: stored.size,
        fileName,
        options: JSON.stringify(options),
        result: JSON.stringify(result),
        createdBy: actor.id,
      })) as number[]
      const details = { recordId: newId, specimenId, sha256: stored.sha256, fileName }
      await recordAudit(trx, { caseId, actorId: actor.id, kind: 'tensile_record.added', details })
      return newId as number
    })
    // The case's own verdict goes beside the engine's answer, which stays exactly the command line's.
    const material = await loadCaseMaterial(db, caseId)
    const caseConformity = judgeAgainstLink(result, options as Record<string, string>, material)
    return { id, sha256: stored.sha256, result, caseConformity }
  } catch (error) {
    await deps.storage.remove(stored.key)
    throw error
  }
}

export async function readRecordFile(deps: RecordDeps, db: Knex, caseId: number, id: number) {
  const row = await findRecord(db, caseId, id)
  return { row, bytes: await deps.storage.read({ key: row.storageKey, sha256: row.sha256 }) }
}

function checkChangeable(row: RecordRow): void {
  if (row.superseded) throw new Conflict('A newer revision replaced this record; change that one.')
  if (row.state === 'invalid')
    throw new Conflict('An invalid record is kept as it is; upload the retest instead.')
}

/**
 * New fit range, offsets or other options for a record. A draft is recomputed in place; a
 * confirmed record stays as it was and the new result becomes its next revision (a draft).
 */
export async function recomputeRecord(
  deps: RecordDeps,
  { actor, db }: ServiceContext,
  caseId: number,
  recordId: number,
  change: TensileRecordRecompute,
): Promise<TensileRecordView> {
  const before = await findRecord(db, caseId, recordId)
  checkChangeable(before)
  checkVersion(before, change.version)
  const options = checkedOptions(change.options)
  const { bytes } = await readRecordFile(deps, db, caseId, recordId)
  const result = await analyse(deps, before.fileName, bytes, options)
  const id = await db.transaction(async (trx) => {
    const row = await findRecord(trx, caseId, recordId, true)
    checkChangeable(row)
    checkVersion(row, change.version)
    const oldOptions = toRecordView(row).options as TensileOptions
    const details = {
      recordId,
      from: outline(oldOptions, JSON.parse(row.result) as SpecimenResult),
      to: outline(options, result),
    }
    const values = { options: JSON.stringify(options), result: JSON.stringify(result) }
    if (row.state === 'draft') {
      await trx('tensile_records')
        .where({ id: recordId })
        .update({ ...values, version: row.version + 1 })
      const kind = 'tensile_record.recomputed'
      await recordAudit(trx, { caseId, actorId: actor.id, kind, details })
      return recordId
    }
    const { id: _id, createdAt: _at, confirmedAt: _ca, confirmedBy: _cb, ...kept } = row
    const [newId] = (await trx('tensile_records').insert({
      ...kept,
      ...values,
      revision: row.revision + 1,
      revisionOf: row.id,
      superseded: false,
      state: 'draft',
      version: 1,
      createdBy: actor.id,
    })) as number[]
    await trx('tensile_records')
      .where({ id: recordId })
      .update({ superseded: true, version: row.version + 1 })
    const revised = { ...details, newRecordId: newId }
    await recordAudit(trx, {
      caseId,
      actorId: actor.id,
      kind: 'tensile_record.revised',
      details: revised,
    })
    return newId as number
  })
  return toRecordView(await findRecord(db, caseId, id))
}

/** Marks a record invalid with its reason, and links the retest that replaces it. */
export async function invalidateRecord(
  { actor, db }: ServiceContext,
  caseId: number,
  recordId: number,
  input: TensileRecordInvalidate & { mayChangeConfirmed: boolean },
): Promise<TensileRecordView> {
  await db.transaction(async (trx) => {
    const row = await findRecord(trx, caseId, recordId, true)
    checkChangeable(row)
    checkVersion(row, input.version)
    if (row.state === 'confirmed' && !input.mayChangeConfirmed)
      throw new Forbidden('Only a lab technician of the case or an administrator may do that.')
    if (input.retestRecordId !== null) {
      if (input.retestRecordId === recordId)
        throw new ValidationError('A record cannot be its own retest.', [
          { path: 'retestRecordId', message: 'A record cannot be its own retest.' },
        ])
      await findRecord(trx, caseId, input.retestRecordId)
    }
    await trx('tensile_records')
      .where({ id: recordId })
      .update({
        state: 'invalid',
        invalidReason: input.reason,
        invalidNote: input.note,
        retestRecordId: input.retestRecordId,
        version: row.version + 1,
      })
    const details = {
      recordId,
      from: row.state,
      reason: input.reason,
      note: input.note,
      retestRecordId: input.retestRecordId,
    }
    await recordAudit(trx, {
      caseId,
      actorId: actor.id,
      kind: 'tensile_record.invalidated',
      details,
    })
  })
  return toRecordView(await findRecord(db, caseId, recordId))
}

/** The lab technician's confirmation: from now on the record is read-only. */
export async function confirmRecord(
  { actor, db }: ServiceContext,
  caseId: number,
  recordId: number,
  version: number,
): Promise<TensileRecordView> {
  await db.transaction(async (trx) => {
    const row = await findRecord(trx, caseId, recordId, true)
    checkChangeable(row)
    checkVersion(row, version)
    if (row.state === 'confirmed') throw new Conflict('This record is already confirmed.')
    await trx('tensile_records')
      .where({ id: recordId })
      .update({
        state: 'confirmed',
        confirmedBy: actor.id,
        confirmedAt: trx.fn.now(),
        version: row.version + 1,
      })
    const details = { recordId, revision: row.revision, sha256: row.sha256 }
    await recordAudit(trx, { caseId, actorId: actor.id, kind: 'tensile_record.confirmed', details })
  })
  return toRecordView(await findRecord(db, caseId, recordId))
}
