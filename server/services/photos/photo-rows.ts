import type { Knex } from 'knex'
import { isStaff } from '../../../shared/access/policy'
import type { FeatureTag, Mark, Photo, PhotoScale } from '../../../shared/schemas/photos'
import { NotFound } from '../../errors'

export interface PhotoRow extends Omit<
  Photo,
  | 'tags'
  | 'marks'
  | 'scale'
  | 'clientVisible'
  | 'magnification'
  | 'takenOn'
  | 'createdAt'
  | 'updatedAt'
> {
  originalKey: string
  displayKey: string
  displaySha256: string
  thumbnailKey: string
  thumbnailSha256: string
  tags: string
  marks: string
  scale: string | null
  clientVisible: number | boolean
  magnification: number | string | null
  takenOn: Date | string | null
  createdAt: Date
  updatedAt: Date
}

const dayOf = (value: Date | string | null) =>
  value === null
    ? null
    : typeof value === 'string'
      ? value.slice(0, 10)
      : value.toISOString().slice(0, 10)

/** The fields a viewer gets: never storage keys. */
export function toPhoto(row: PhotoRow): Photo {
  return {
    id: row.id,
    caseId: row.caseId,
    sampleId: row.sampleId,
    fileName: row.fileName,
    mediaType: row.mediaType,
    size: row.size,
    sha256: row.sha256,
    width: row.width,
    height: row.height,
    displayWidth: row.displayWidth,
    displayHeight: row.displayHeight,
    caption: row.caption,
    kind: row.kind,
    magnification: row.magnification === null ? null : Number(row.magnification),
    takenBy: row.takenBy,
    takenOn: dayOf(row.takenOn),
    tags: JSON.parse(row.tags) as FeatureTag[],
    clientVisible: Boolean(row.clientVisible),
    scale: row.scale === null ? null : (JSON.parse(row.scale) as PhotoScale),
    marks: JSON.parse(row.marks) as Mark[],
    version: row.version,
    uploadedBy: row.uploadedBy,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
  }
}

/** The case's photos a viewer may see: staff all of them, a client those marked for the client. */
export function visiblePhotos(db: Knex, actor: Parameters<typeof isStaff>[0], caseId: number) {
  const query = db('photos').where({ caseId })
  if (!isStaff(actor)) query.where({ clientVisible: true })
  return query
}

export async function findPhotoRow(
  db: Knex,
  actor: Parameters<typeof isStaff>[0],
  caseId: number,
  photoId: number,
  forUpdate = false,
): Promise<PhotoRow> {
  const query = visiblePhotos(db, actor, caseId).where({ id: photoId })
  if (forUpdate) query.forUpdate()
  const row = (await query.first()) as PhotoRow | undefined
  // the same answer as for an id that does not exist, so ids cannot be probed
  if (!row) throw new NotFound()
  return row
}
