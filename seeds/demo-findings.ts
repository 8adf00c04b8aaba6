import { mkdtempSync, rmSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import type { Knex } from 'knex'
import sharp from 'sharp'
import type { Actor } from '../shared/access/policy'
import type { Block, FindingsDocument } from '../shared/findings/document'
import { findingsTemplate } from '../shared/findings/template'
import { ObservationCreate } from '../shared/schemas/observations'
import { PhotoUpdate } from '../shared/schemas/photos'
import { createObservationService } from '../server/services/evidence/observations'
import { createFindingsService } from '../server/services/findings'
import { createPhotoService } from '../server/services/photos/photos'
import type { FileStorage } from '../server/storage/file-storage'
import {
  DEMO_FINDINGS,
  PHOTO_ID_PLACEHOLDER,
  type DemoFindings,
  type DemoPhoto,
} from './demo-findings-scenario'

const WIDTH = 1200
const HEIGHT = 900

/** A drawn stand-in for a fracture photograph: a grey face with arcs spreading from the origin. */
async function drawnPhoto(photo: DemoPhoto): Promise<Buffer> {
  const [ox, oy] = [photo.origin[0] * WIDTH, photo.origin[1] * HEIGHT]
  const arcs = Array.from(
    { length: 9 },
    (_, i) =>
      `<circle cx="${ox}" cy="${oy}" r="${60 + i * 55}" fill="none" stroke="#8a8d90" stroke-width="${2 + (i % 3)}" opacity="0.55"/>`,
  ).join('')
  const svg = `<svg xmlns="http://www.w3.org/2000/svg" width="${WIDTH}" height="${HEIGHT}">
    <rect width="100%" height="100%" fill="#2b2d30"/>
    <ellipse cx="${WIDTH / 2}" cy="${HEIGHT / 2}" rx="470" ry="400" fill="#6d7074"/>
    <g clip-path="url(#face)">${arcs}</g>
    <clipPath id="face"><ellipse cx="${WIDTH / 2}" cy="${HEIGHT / 2}" rx="470" ry="400"/></clipPath>
  </svg>`
  return sharp(Buffer.from(svg)).jpeg({ quality: 85 }).toBuffer()
}

function placeInSections(blocks: Partial<Record<string, Block[]>>): FindingsDocument {
  const template = findingsTemplate()
  const content: Block[] = []
  let section: string | null = null
  for (const block of template.content) {
    if (block.type === 'heading') section = block.attrs.section
    const filled = section ? blocks[section] : undefined
    // the template's empty paragraph under a section gives way to the demo's text
    if (block.type === 'paragraph' && filled?.length) content.push(...filled)
    else content.push(block)
  }
  return { type: 'doc', content }
}

function withPhotoIds(doc: FindingsDocument, photoOf: Map<string, number>): FindingsDocument {
  const content = doc.content.map((block) =>
    block.type === 'figure' && block.attrs.photoId === PHOTO_ID_PLACEHOLDER
      ? { ...block, attrs: { ...block.attrs, photoId: photoOf.get(block.attrs.figureId)! } }
      : block,
  )
  return { type: 'doc', content }
}

async function storePhotos(
  trx: Knex,
  caseId: number,
  lead: Actor,
  storage: FileStorage,
  demo: DemoFindings,
) {
  const photos = createPhotoService({ storage })
  const ctx = { actor: lead, db: trx }
  const folder = mkdtempSync(join(tmpdir(), 'fractolog-demo-photos-'))
  try {
    const ids: number[] = []
    for (const photo of demo.photos) {
      const path = join(folder, photo.fileName)
      writeFileSync(path, await drawnPhoto(photo))
      const stored = await photos.ingest(ctx, caseId, { path, originalname: photo.fileName })
      const { caption, kind, tags, marks, micrometresPerPixel } = photo
      const change = { version: stored.version, caption, kind, tags, marks }
      const scale = { micrometresPerPixel, line: null }
      await photos.update(ctx, caseId, stored.id, PhotoUpdate.parse({ ...change, scale }))
      ids.push(stored.id)
    }
    return ids
  } finally {
    rmSync(folder, { recursive: true, force: true })
  }
}

/**
 * A drafting demo case's photographs, observations and findings draft, written by its lead
 * through the same services the API uses; files go to the storage the demo is given.
 */
export async function seedDemoFindings(
  trx: Knex,
  caseId: number,
  title: string,
  lead: Actor,
  storage: FileStorage,
  today: Date,
): Promise<void> {
  const demo = DEMO_FINDINGS[title]
  if (!demo) return
  const ctx = { actor: lead, db: trx }
  const photoIds = await storePhotos(trx, caseId, lead, storage, demo)
  const observations = createObservationService()
  for (const observation of demo.observations) {
    const input = { text: observation.text, photoIds: observation.photos.map((i) => photoIds[i]) }
    await observations.create(ctx, caseId, ObservationCreate.parse(input))
  }
  const figureIds = photoIds.map((_, index) => `demo-fig-${index + 1}`)
  const photoOf = new Map(figureIds.map((figureId, index) => [figureId, photoIds[index]!]))
  const doc = withPhotoIds(placeInSections(demo.draft(figureIds)), photoOf)
  await createFindingsService({ clock: () => today }).save(ctx, caseId, { doc, version: 0 })
}
