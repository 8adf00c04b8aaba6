import type { Knex } from 'knex'
import { PHOTO_MEDIA_TYPES, type Photo, type PhotoUpdate } from '../../../shared/schemas/photos'
import { AppError, ValidationError } from '../../errors'
import { displayName } from '../../storage/display-name'
import type { FileStorage } from '../../storage/file-storage'
import { recogniseFileType } from '../../storage/recognise-type'
import { recordAudit } from '../audit'
import type { ServiceContext } from '../context'
import { removeFiles, storePhotoFiles } from './photo-files'
import { renderFigure } from './figure'
import { findPhotoRow, toPhoto, visiblePhotos, type PhotoRow } from './photo-rows'

export type PhotoCopy = 'original' | 'display' | 'thumbnail'

/** A photo shows a sample of its own case, or none. */
async function checkSample(db: Knex, caseId: number, sampleId: number | null | undefined) {
  if (sampleId === null || sampleId === undefined) return
  const exists = await db('samples').where({ id: sampleId, caseId }).first('id')
  if (!exists) {
    const message = 'Choose a sample of this case.'
    throw new ValidationError(message, [{ path: 'sampleId', message }])
  }
}

export function createPhotoService(deps: { storage: FileStorage; maxPixels?: number }) {
  const { storage } = deps

  async function list({ actor, db }: ServiceContext, caseId: number, sampleId?: number) {
    const query = visiblePhotos(db, actor, caseId).orderBy('id')
    if (sampleId !== undefined) query.where({ sampleId })
    return ((await query) as PhotoRow[]).map(toPhoto)
  }

  async function get({ actor, db }: ServiceContext, caseId: number, photoId: number) {
    return toPhoto(await findPhotoRow(db, actor, caseId, photoId))
  }

  /**
   * Takes in an uploaded image held in a temporary file: type from its content, decoded whole
   * under the pixel limit, the original kept byte for byte with its SHA-256, display copy and
   * thumbnail derived. Files first, then the row; if the row fails the files go again, and files
   * a crash leaves without a row are swept at the next start.
   */
  async function ingest(
    { actor, db }: ServiceContext,
    caseId: number,
    upload: { path: string; originalname: string },
    sampleId?: number,
  ): Promise<Photo> {
    const fileName = displayName(upload.originalname, 'photo')
    const mediaType = await recogniseFileType(upload.path, PHOTO_MEDIA_TYPES, fileName)
    await checkSample(db, caseId, sampleId)
    const files = await storePhotoFiles(storage, upload.path, fileName, deps.maxPixels)
    const { copies, original, display, thumbnail } = files
    try {
      const id = await db.transaction(async (trx) => {
        const [newId] = (await trx('photos').insert({
          caseId,
          sampleId: sampleId ?? null,
          originalKey: original.key,
          sha256: original.sha256,
          size: original.size,
          mediaType,
          fileName,
          width: copies.width,
          height: copies.height,
          displayKey: display.key,
          displaySha256: display.sha256,
          displayWidth: copies.display.width,
          displayHeight: copies.display.height,
          thumbnailKey: thumbnail.key,
          thumbnailSha256: thumbnail.sha256,
          tags: '[]',
          marks: '[]',
          uploadedBy: actor.id,
        })) as number[]
        const details = { photoId: newId, fileName, sha256: original.sha256, size: original.size }
        await recordAudit(trx, { caseId, actorId: actor.id, kind: 'photo.added', details })
        return newId as number
      })
      return get({ actor, db }, caseId, id)
    } catch (error) {
      await removeFiles(storage, [original, display, thumbnail])
      throw error
    }
  }

  function staleVersion(current: Photo): AppError {
    return new AppError(
      'version_conflict',
      'Someone else changed this photo after you opened it. Nothing was saved.',
      { current },
    )
  }

  async function update(
    { actor, db }: ServiceContext,
    caseId: number,
    photoId: number,
    change: PhotoUpdate,
  ): Promise<Photo> {
    await checkSample(db, caseId, change.sampleId)
    await db.transaction(async (trx) => {
      const current = toPhoto(await findPhotoRow(trx, actor, caseId, photoId, true))
      if (current.version !== change.version) throw staleVersion(current)
      const { version, ...patch } = change
      const fields = (Object.keys(patch) as (keyof typeof patch)[]).filter(
        (field) =>
          patch[field] !== undefined &&
          JSON.stringify(current[field]) !== JSON.stringify(patch[field]),
      )
      if (fields.length === 0) return
      const stored = (field: keyof typeof patch) =>
        ['tags', 'marks', 'scale'].includes(field) && patch[field] !== null
          ? JSON.stringify(patch[field])
          : patch[field]
      const values = Object.fromEntries(fields.map((field) => [field, stored(field)]))
      await trx('photos')
        .where({ id: photoId })
        .update({ ...values, version: version + 1, updatedAt: trx.fn.now(3) })
      const changes = Object.fromEntries(
        fields.map((field) => [field, { from: current[field], to: patch[field] }]),
      )
      const details = { photoId, changes }
      await recordAudit(trx, { caseId, actorId: actor.id, kind: 'photo.changed', details })
    })
    return get({ actor, db }, caseId, photoId)
  }

  /** One of the photo's files, checked against its recorded SHA-256 before it is served. */
  async function readCopy(
    { actor, db }: ServiceContext,
    caseId: number,
    photoId: number,
    copy: PhotoCopy,
  ) {
    const row = await findPhotoRow(db, actor, caseId, photoId)
    const file = {
      original: { key: row.originalKey, sha256: row.sha256, mediaType: row.mediaType },
      display: { key: row.displayKey, sha256: row.displaySha256, mediaType: 'image/jpeg' },
      thumbnail: { key: row.thumbnailKey, sha256: row.thumbnailSha256, mediaType: 'image/jpeg' },
    }[copy]
    return { photo: toPhoto(row), mediaType: file.mediaType, bytes: await storage.read(file) }
  }

  /** The display copy with the marks and scale bar drawn in, as a PNG. */
  async function figure(ctx: ServiceContext, caseId: number, photoId: number) {
    const { photo, bytes } = await readCopy(ctx, caseId, photoId, 'display')
    const png = await renderFigure(bytes, {
      marks: photo.marks,
      scale: photo.scale,
      originalWidth: photo.width,
    })
    return { photo, png }
  }

  return { list, get, ingest, update, readCopy, figure }
}

export type PhotoService = ReturnType<typeof createPhotoService>

/** The case a photo belongs to, for the child-id loader. */
export async function caseOfPhoto(db: Knex, photoId: number): Promise<number | undefined> {
  const row = (await db('photos').where({ id: photoId }).first('caseId')) as
    { caseId: number } | undefined
  return row?.caseId
}

/** Which of these storage keys a record names (attachments and photos), for the start-up sweep. */
export async function knownStorageKeys(db: Knex, keys: string[]): Promise<Set<string>> {
  if (keys.length === 0) return new Set()
  const [attachments, records, photos, figures, pdfs] = (await Promise.all([
    db('attachments').whereIn('storageKey', keys).select('storageKey'),
    db('tensileRecords').whereIn('storageKey', keys).select('storageKey'),
    db('photos')
      .whereIn('originalKey', keys)
      .orWhereIn('displayKey', keys)
      .orWhereIn('thumbnailKey', keys)
      .select('originalKey', 'displayKey', 'thumbnailKey'),
    db('reportFigures').whereIn('storageKey', keys).select('storageKey'),
    db('reportPdfs').whereIn('storageKey', keys).select('storageKey'),
  ])) as [
    { storageKey: string }[],
    { storageKey: string }[],
    { originalKey: string; displayKey: string; thumbnailKey: string }[],
    { storageKey: string }[],
    { storageKey: string }[],
  ]
  return new Set([
    ...attachments.map((row) => row.storageKey),
    ...records.map((row) => row.storageKey),
    ...photos.flatMap((row) => [row.originalKey, row.displayKey, row.thumbnailKey]),
    ...figures.map((row) => row.storageKey),
    ...pdfs.map((row) => row.storageKey),
  ])
}
