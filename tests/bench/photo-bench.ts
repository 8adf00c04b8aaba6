import { spawnSync } from 'node:child_process'
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import path from 'node:path'
import { performance } from 'node:perf_hooks'
import sharp from 'sharp'
import { resolveDatabase } from '../../server/db/database-url'
import { DISPLAY_SIZE } from '../../server/services/photos/image-derivatives'
import { storePhotoFiles } from '../../server/services/photos/photo-files'
import { createLocalStorage } from '../../server/storage/local-storage'

/*
 * Benchmark (issue targets): ingest of a 24-megapixel JPEG — original stored with its SHA-256,
 * display copy and thumbnail derived and stored — within 1.3 × a bare sharp resize of the same
 * file to the display copy's size; peak memory under 1 GB while ten such files are uploaded at
 * once through the HTTP app. Medians of 7 alternating runs. It prints figures; it asserts nothing.
 */
const RUNS = 7
const REPO_ROOT = path.resolve(import.meta.dirname, '../..')

/** 6000 × 4000 px: a gradient with fine noise, so the JPEG has a camera-like size and detail. */
async function write24MegapixelJpeg(file: string) {
  const [width, height] = [6000, 4000]
  const noise = await sharp({
    create: {
      width,
      height,
      channels: 3,
      background: '#000000',
      noise: { type: 'gaussian', mean: 128, sigma: 18 },
    },
  })
    .raw()
    .toBuffer()
  const gradient = Buffer.alloc(width * height * 3)
  for (let i = 0; i < gradient.length; i++) gradient[i] = (noise[i]! + ((i / 3) % width) / 40) & 255
  const jpeg = await sharp(gradient, { raw: { width, height, channels: 3 } })
    .jpeg({ quality: 90 })
    .toBuffer()
  writeFileSync(file, jpeg)
  return jpeg.length
}

const bareResize = (file: string) =>
  sharp(file).resize(DISPLAY_SIZE, DISPLAY_SIZE, { fit: 'inside' }).jpeg().toBuffer()

/** What the upload route does with the file it received, up to the database row. */
const ingest = (file: string, storage: ReturnType<typeof createLocalStorage>) =>
  storePhotoFiles(storage, file, 'bench.jpg')

async function timed(work: () => Promise<unknown>) {
  const start = performance.now()
  await work()
  return performance.now() - start
}

const median = (values: number[]) =>
  [...values].sort((a, b) => a - b)[Math.floor(values.length / 2)]!

function tenUploadsPeakMb(file: string, databaseUrl: string) {
  const run = spawnSync(
    process.execPath,
    [
      '--import',
      'tsx',
      '--import',
      './tests/bench/report-peak-memory.ts',
      'tests/bench/photo-ingest-child.ts',
      file,
    ],
    { cwd: REPO_ROOT, encoding: 'utf8', env: { ...process.env, BENCH_DATABASE_URL: databaseUrl } },
  )
  const kb = Number(/peak-rss-kb (\d+)/.exec(run.stderr)?.[1])
  const ms = Number(/ten-uploads-ms (\d+)/.exec(run.stdout)?.[1])
  if (run.status !== 0 || !Number.isFinite(kb)) throw new Error(`uploads failed: ${run.stderr}`)
  return { mb: kb / 1024, ms }
}

async function main() {
  const folder = mkdtempSync(path.join(tmpdir(), 'fractolog-photo-bench-'))
  const database = await resolveDatabase(process.env.TEST_DATABASE_URL, 'fractolog_bench')
  try {
    const file = path.join(folder, 'large.jpg')
    const size = await write24MegapixelJpeg(file)
    const storage = createLocalStorage(path.join(folder, 'store'))
    await bareResize(file)
    await ingest(file, storage)
    const bare: number[] = []
    const full: number[] = []
    for (let run = 0; run < RUNS; run++) {
      bare.push(await timed(() => bareResize(file)))
      full.push(await timed(() => ingest(file, storage)))
    }
    const ratio = median(full) / median(bare)
    console.log(`24-megapixel JPEG, ${(size / 1024 / 1024).toFixed(1)} MB, medians of ${RUNS} runs`)
    console.log(`  bare sharp resize to ${DISPLAY_SIZE} px: ${median(bare).toFixed(0)} ms`)
    console.log(`  ingest (hash, store, display copy, thumbnail): ${median(full).toFixed(0)} ms`)
    console.log(`  ratio ${ratio.toFixed(2)} (target ≤ 1.30) ${ratio <= 1.3 ? 'met' : 'NOT MET'}`)
    const uploads = tenUploadsPeakMb(file, database.url)
    console.log(`ten parallel uploads through the app: ${uploads.ms} ms`)
    const met = uploads.mb < 1024 ? 'met' : 'NOT MET'
    console.log(`  peak resident memory ${uploads.mb.toFixed(0)} MB (target < 1024 MB) ${met}`)
  } finally {
    rmSync(folder, { recursive: true, force: true })
    await database.local?.stop()
  }
}

await main()
