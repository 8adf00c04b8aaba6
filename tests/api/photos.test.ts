import { createHash } from 'node:crypto'
import { readdirSync, writeFileSync } from 'node:fs'
import { join } from 'node:path'
import sharp from 'sharp'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import type { FileStorage } from '../../server/storage/file-storage'
import { sweepUploads } from '../../server/storage/sweep-uploads'
import { MAX_PHOTO_BYTES } from '../../shared/schemas/photos'
import { makeCase, makeOrganisation, makePeople, type TestPerson } from '../factories'
import { tinyPdf } from '../factories/files'
import {
  plainJpeg,
  plainPng,
  plainWebp,
  pngClaiming,
  sidewaysJpegWithGps,
  sixteenBitTiff,
  truncatedJpeg,
} from '../factories/images'
import { signInAll, type ApiSession } from '../helpers/api-session'
import { appWithUploads } from '../helpers/app-with-uploads'
import { createTestDb, resetDatabase } from '../helpers/test-db'

const db = createTestDb()
// lets a test make the third stored file fail, as a full disk would
const faults = { failOnPut: false }
const logged: unknown[] = []
const { app, uploads, incomingDir, storage, cleanup } = appWithUploads(db, {
  storage: (local): FileStorage => ({
    ...local,
    put: (bytes) => (faults.failOnPut ? Promise.reject(new Error('disk full')) : local.put(bytes)),
  }),
  log: (error) => logged.push(error),
})

type Key = 'admin' | 'lead' | 'lab' | 'otherLab' | 'reviewer' | 'client' | 'client2'
let people: Record<Key, TestPerson>
let sessions: Record<Key, ApiSession>
let caseId: number

beforeAll(async () => {
  await resetDatabase(db)
  const orgA = await makeOrganisation(db)
  const orgB = await makeOrganisation(db)
  people = await makePeople(db, {
    admin: ['admin'],
    lead: ['investigator'],
    lab: ['lab'],
    otherLab: ['lab'],
    reviewer: ['reviewer'],
    client: { roles: ['client'], organisationId: orgA },
    client2: { roles: ['client'], organisationId: orgB },
  })
  sessions = await signInAll(app, people)
  const made = await makeCase(db, orgA, people.admin.id, {
    leadInvestigatorId: people.lead.id,
    labTechnicianId: people.lab.id,
  })
  caseId = made.id
})
afterAll(async () => {
  await db.destroy()
  cleanup()
})

const photosPath = () => `/api/cases/${caseId}/photos`
const sha256 = (bytes: Buffer) => createHash('sha256').update(bytes).digest('hex')
const count = async (table: string) =>
  Number(((await db(table).count({ n: '*' })) as [{ n: number }])[0].n)

/** Every stored file (`ab/<uuid>`, half-written ones included) and every upload still waiting. */
function filesOnDisk() {
  const stored = readdirSync(uploads)
    .filter((name) => /^[0-9a-f]{2}$/.test(name))
    .flatMap((folder) => readdirSync(join(uploads, folder)).map((name) => `${folder}/${name}`))
  const waiting = readdirSync(incomingDir)
  return { stored, waiting }
}

function upload(session: ApiSession, bytes: Buffer, name: string, fields: object = {}) {
  const request = session.agent.post(photosPath()).set('X-CSRF-Token', session.token)
  for (const [field, value] of Object.entries(fields)) request.field(field, String(value))
  return request.attach('file', bytes, name)
}

function download(session: ApiSession, path: string) {
  return session.agent
    .get(path)
    .buffer(true)
    .parse((res, done) => {
      const chunks: Buffer[] = []
      res.on('data', (chunk: Buffer) => chunks.push(chunk))
      res.on('end', () => done(null, Buffer.concat(chunks)))
    })
}

async function addPhoto(bytes?: Buffer, name = 'fracture.jpg') {
  const response = await upload(sessions.lead, bytes ?? (await plainJpeg()), name)
  expect(response.status, JSON.stringify(response.body)).toBe(201)
  return response.body.data as { id: number; version: number; width: number; height: number }
}

describe('uploading photographs', () => {
  it('keeps a phone JPEG byte for byte and derives upright copies without any metadata', async () => {
    const jpeg = await sidewaysJpegWithGps(120, 80)
    const source = await sharp(jpeg).metadata()
    expect(source.orientation).toBe(6)
    // the GPS directory's pointer tag 0x8825 (EXIF 2.32, 4.6.3) is in the original's EXIF block,
    // written in the block's byte order ("II" little-endian, "MM" big-endian after "Exif\0\0")
    const exif = source.exif as Buffer
    const gpsTag = exif.toString('latin1', 6, 8) === 'II' ? [0x25, 0x88] : [0x88, 0x25]
    expect(exif.includes(Buffer.from(gpsTag))).toBe(true)

    const response = await upload(sessions.lead, jpeg, 'IMG_0042.JPG').expect(201)
    const photo = response.body.data
    // SHA-256 per FIPS 180-4, computed here with node:crypto
    expect(photo).toMatchObject({ sha256: sha256(jpeg), size: jpeg.length, width: 80, height: 120 })
    expect(photo).toMatchObject({ mediaType: 'image/jpeg', fileName: 'IMG_0042.JPG' })

    const original = await download(sessions.lab, `/api/photos/${photo.id}/original`).expect(200)
    expect(Buffer.compare(original.body as Buffer, jpeg)).toBe(0)
    expect(original.headers['cache-control']).toContain('private')
    // a cached copy is tied to the session cookie, so the next person signed in is checked anew
    expect(original.headers.vary).toContain('Cookie')

    for (const copy of ['display', 'thumbnail']) {
      const served = await download(sessions.lab, `/api/photos/${photo.id}/${copy}`).expect(200)
      const bytes = served.body as Buffer
      const meta = await sharp(bytes).metadata()
      expect(meta, copy).toMatchObject({ width: 80, height: 120 })
      expect([meta.exif, meta.xmp, meta.iptc, meta.icc, meta.orientation], copy).toEqual([
        undefined,
        undefined,
        undefined,
        undefined,
        undefined,
      ])
      expect(bytes.includes(Buffer.from('Fractolog test')), copy).toBe(false)
      // Orientation 6 turns the stored top-left corner to the top right (TIFF 6.0, tag 274)
      const { data, info } = await sharp(bytes).raw().toBuffer({ resolveWithObject: true })
      const brightness = (x: number, y: number) => data[(y * info.width + x) * info.channels]!
      expect(brightness(info.width - 3, 3), copy).toBeGreaterThan(230)
      expect(brightness(2, info.height - 3), copy).toBeLessThan(200)
    }
  })

  it('accepts PNG, 16-bit TIFF and WebP by their content, whatever their names', async () => {
    const tiff = await sixteenBitTiff()
    expect((await sharp(tiff).metadata()).depth).toBe('ushort')
    const files: [Buffer, string, string][] = [
      [await plainPng(), 'section.tif', 'image/png'],
      [tiff, 'sem-0007.png', 'image/tiff'],
      [await plainWebp(), 'macro', 'image/webp'],
    ]
    for (const [bytes, name, mediaType] of files) {
      const response = await upload(sessions.lab, bytes, name)
      expect(response.status, name).toBe(201)
      expect(response.body.data, name).toMatchObject({
        mediaType,
        sha256: sha256(bytes),
        width: 64,
        height: 48,
      })
      const display = await download(sessions.lead, `/api/photos/${response.body.data.id}/display`)
      expect((await sharp(display.body as Buffer).metadata()).depth, name).toBe('uchar')
    }
  })

  it('refuses what is not a readable image, each refusal naming the file, and leaves nothing behind', async () => {
    const rowsBefore = await count('photos')
    const activityBefore = await count('audit_events')
    const oversize = Buffer.alloc(MAX_PHOTO_BYTES + 1)
    ;(await plainJpeg()).copy(oversize)
    const refusals: [Buffer, string, number, string][] = [
      [tinyPdf(), 'report.jpg', 415, 'unsupported_file_type'],
      [Buffer.from('Crack found at the weld toe.\n'), 'notes.png', 415, 'unsupported_file_type'],
      [await truncatedJpeg(), 'cut-short.jpg', 422, 'image_unreadable'],
      [await pngClaiming(40_000, 40_000), 'bomb.png', 422, 'image_too_large'],
      [oversize, 'huge.jpg', 413, 'payload_too_large'],
    ]
    for (const [bytes, name, status, code] of refusals) {
      const response = await upload(sessions.lead, bytes, name)
      expect(response.status, name).toBe(status)
      expect(response.body.error.code, name).toBe(code)
      expect(response.body.error.details.fileName, name).toBe(name)
      expect(response.body.error.message, name).toContain(name)
    }
    expect(await count('photos')).toBe(rowsBefore)
    expect(await count('audit_events')).toBe(activityBefore)
    const { stored, waiting } = filesOnDisk()
    expect(stored.length).toBe(3 * rowsBefore)
    expect(waiting).toEqual([])
  })

  it('writes no row and keeps no file when storing a copy fails half-way', async () => {
    const rowsBefore = await count('photos')
    faults.failOnPut = true
    try {
      const response = await upload(sessions.lead, await plainJpeg(), 'disk-full.jpg')
      expect(response.status).toBe(500)
      expect(String(logged.at(-1))).toContain('disk full')
    } finally {
      faults.failOnPut = false
    }
    expect(await count('photos')).toBe(rowsBefore)
    const { stored, waiting } = filesOnDisk()
    expect(stored.length).toBe(3 * rowsBefore)
    expect(waiting).toEqual([])
  })

  it('sweeps at start what a crash left: waiting uploads, half-written files, files no record names', async () => {
    await addPhoto()
    const before = filesOnDisk().stored
    const stray = await storage.put(Buffer.from('left by a crash'))
    writeFileSync(join(uploads, `${stray.key}.partial`), 'half')
    writeFileSync(join(incomingDir, 'interrupted.upload'), 'part of an image')
    expect(await sweepUploads(db, uploads)).toBe(3)
    expect(filesOnDisk().stored.sort()).toEqual(before.sort())
    expect(filesOnDisk().waiting).toEqual([])
  })

  it('lets the case’s people upload and refuses the rest', async () => {
    await upload(sessions.lab, await plainJpeg(), 'a.jpg').expect(201)
    await upload(sessions.otherLab, await plainJpeg(), 'a.jpg').expect(403)
    await upload(sessions.reviewer, await plainJpeg(), 'a.jpg').expect(403)
    await upload(sessions.client, await plainJpeg(), 'a.jpg').expect(403)
    await upload(sessions.client2, await plainJpeg(), 'a.jpg').expect(404)
    expect(filesOnDisk().waiting).toEqual([])
  })

  it('refuses a sample that is not this case’s', async () => {
    const response = await upload(sessions.lead, await plainJpeg(), 'a.jpg', { sampleId: 424242 })
    expect(response.status).toBe(400)
    expect(response.body.error.details[0].path).toBe('sampleId')
    expect(filesOnDisk().waiting).toEqual([])
  })
})

describe('who sees which photo', () => {
  it('shows a client only the photos marked for the client; another organisation nothing', async () => {
    const shown = await addPhoto()
    const hidden = await addPhoto()
    await sessions.lead
      .patch(`/api/photos/${shown.id}`, { version: 1, clientVisible: true })
      .expect(200)
    const list = await sessions.client.get(photosPath()).expect(200)
    const ids = list.body.data.map((photo: { id: number }) => photo.id)
    expect(ids).toContain(shown.id)
    expect(ids).not.toContain(hidden.id)
    for (const copy of ['', '/original', '/display', '/thumbnail', '/figure']) {
      await sessions.client.get(`/api/photos/${shown.id}${copy}`).expect(200)
      const guessed = await sessions.client.get(`/api/photos/${hidden.id}${copy}`)
      const missing = await sessions.client.get(`/api/photos/987654${copy}`)
      expect(guessed.status, copy).toBe(404)
      expect(guessed.body, copy).toEqual(missing.body)
      await sessions.client2.get(`/api/photos/${shown.id}${copy}`).expect(404)
    }
    await sessions.client2.get(photosPath()).expect(404)
    await sessions.client.patch(`/api/photos/${shown.id}`, { version: 2, caption: 'x' }).expect(403)
  })
})

describe('describing, calibrating and marking a photo', () => {
  it('saves the description, scale and marks with the version read, each change on the trail', async () => {
    const photo = await addPhoto()
    const change = {
      version: 1,
      caption: 'Fracture face of the pin, origin at the keyway corner',
      kind: 'stereo',
      magnification: 6.3,
      takenBy: 'A. Lab',
      takenOn: '2026-11-30',
      tags: ['origin', 'beach_marks'],
      scale: {
        micrometresPerPixel: 12.5,
        line: { from: { x: 0, y: 0 }, to: { x: 30, y: 40 }, micrometres: 625 },
      },
      marks: [
        { kind: 'arrow', from: { x: 5, y: 5 }, to: { x: 30, y: 20 } },
        { kind: 'label', at: { x: 10, y: 40 }, text: 'Origin <A>' },
        { kind: 'circle', centre: { x: 32, y: 24 }, radius: 8 },
        {
          kind: 'outline',
          points: [
            { x: 1, y: 1 },
            { x: 9, y: 1 },
            { x: 9, y: 9 },
          ],
        },
      ],
    }
    const saved = await sessions.lab.patch(`/api/photos/${photo.id}`, change).expect(200)
    expect(saved.body.data).toMatchObject({ ...change, version: 2 })
    const trail = await db('audit_events').where({ action: 'photo.changed' })
    const detailsOf = (row: { details: unknown }) =>
      (typeof row.details === 'string' ? JSON.parse(row.details) : row.details) as {
        photoId: number
      }
    expect(trail.some((row) => detailsOf(row).photoId === photo.id)).toBe(true)
    const stale = await sessions.lead.patch(`/api/photos/${photo.id}`, { version: 1, caption: 'x' })
    expect(stale.status).toBe(409)
    expect(stale.body.error.details.current.caption).toBe(change.caption)
  })

  it('refuses malformed marks, scales and tags', async () => {
    const photo = await addPhoto()
    const bad: [object, string][] = [
      [{ marks: [{ kind: 'star', at: { x: 1, y: 1 } }] }, 'marks.0.kind'],
      [{ marks: [{ kind: 'label', at: { x: 1, y: 1 }, text: '  ' }] }, 'marks.0.text'],
      [{ scale: { micrometresPerPixel: 0 } }, 'scale.micrometresPerPixel'],
      [{ tags: ['fatigue'] }, 'tags.0'],
      [{ kind: 'selfie' }, 'kind'],
      [{ sampleId: 5 }, 'sampleId'],
    ]
    for (const [change, path] of bad) {
      const response = await sessions.lead.patch(`/api/photos/${photo.id}`, {
        version: 1,
        ...change,
      })
      expect(response.status, path).toBe(400)
      expect(response.body.error.details[0].path, path).toBe(path)
    }
  })

  it('exports a figure with the marks and a scale bar drawn in', async () => {
    // 2000 px wide: the display copy keeps every pixel (it is at most 2048 px on its long side)
    const photo = await addPhoto(await plainJpeg(2000, 1500), 'wide.jpg')
    await sessions.lead
      .patch(`/api/photos/${photo.id}`, {
        version: 1,
        scale: { micrometresPerPixel: 0.5 },
        marks: [{ kind: 'arrow', from: { x: 200, y: 750 }, to: { x: 1000, y: 750 } }],
      })
      .expect(200)
    const figure = await download(sessions.lead, `/api/photos/${photo.id}/figure`).expect(200)
    expect(figure.headers['content-type']).toBe('image/png')
    const { data, info } = await sharp(figure.body as Buffer)
      .raw()
      .toBuffer({ resolveWithObject: true })
    expect([info.width, info.height]).toEqual([2000, 1500])
    const pixel = (x: number, y: number) => [
      ...data.subarray(
        (y * info.width + x) * info.channels,
        (y * info.width + x) * info.channels + 3,
      ),
    ]
    // the arrow's shaft is drawn in yellow ink (#ffd400) halfway along
    const [r, g, b] = pixel(600, 750)
    expect(r).toBeGreaterThan(230)
    expect(g).toBeGreaterThan(190)
    expect(b).toBeLessThan(60)
    // scale bar: 2000 px × 0.5 µm = 1000 µm wide; a fifth is 200 µm, itself a round length
    // (1-2-5 series, common practice), so the bar is 200 µm / 0.5 µm per px = 400 px of white
    const barRow = Array.from({ length: 200 }, (_, i) => info.height - 1 - i).find((y) =>
      pixel(info.width - 100, y).every((channel) => channel > 245),
    ) as number
    expect(barRow).toBeDefined()
    let white = 0
    for (let x = 0; x < info.width; x++) if (pixel(x, barRow).every((c) => c > 245)) white++
    expect(white).toBeGreaterThanOrEqual(399)
    expect(white).toBeLessThanOrEqual(401)
  })
})
