import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import sharp from 'sharp'
import { describe, expect, inject, it } from 'vitest'
import { screenshot, signIn, unexpectedErrors, useBrowser } from '../helpers/browser'

const browser = useBrowser()

/** A camera-like JPEG of some hundreds of kilobytes (noise compresses badly), so upload takes time. */
async function noisyJpeg(file: string, shade: string) {
  const bytes = await sharp({
    create: {
      width: 900,
      height: 600,
      channels: 3,
      background: shade,
      noise: { type: 'gaussian', mean: 110, sigma: 40 },
    },
  })
    .jpeg({ quality: 95 })
    .toBuffer()
  writeFileSync(file, bytes)
  return file
}

describe('photographs of a case', () => {
  it('uploads with progress, calibrates, marks, exports a figure; another client cannot reach them', async () => {
    const { page, context } = browser()
    const base = inject('baseUrl')
    const folder = mkdtempSync(join(tmpdir(), 'fractolog-photos-'))
    const files = [
      await noisyJpeg(join(folder, 'fracture face.jpg'), '#555555'),
      await noisyJpeg(join(folder, 'pin overall.jpg'), '#777777'),
    ]

    await signIn(page, base, 'investigator@demo.test', inject('demoPassword'))
    await page.goto(`${base}/cases?q=${encodeURIComponent('hook block pin')}`)
    await page.getByTestId('case-table').getByText('Fractured hook block pin').click()
    await page.waitForURL(/\/cases\/\d+$/)
    const caseUrl = page.url()
    await page.getByTestId('section-case-evidence').click()
    await page.getByTestId('evidence-photos').click()
    await page.waitForURL(/\/evidence\/photos$/)

    // about 100 kB/s up: each file takes seconds, so the progress bars show part-way values
    const cdp = await context.newCDPSession(page)
    await cdp.send('Network.enable')
    await cdp.send('Network.emulateNetworkConditions', {
      offline: false,
      latency: 20,
      downloadThroughput: -1,
      uploadThroughput: 100 * 1024,
    })
    await page.getByTestId('photo-input').setInputFiles(files)
    await expect.poll(() => page.getByTestId('upload-item').count()).toBe(2)
    const partWay = async () => {
      const values = await page
        .getByTestId('upload-progress')
        .evaluateAll((bars) => bars.map((bar) => Number(bar.getAttribute('data-progress'))))
      return values.some((value) => value > 0 && value < 100)
    }
    await expect.poll(partWay, { timeout: 15_000, interval: 100 }).toBe(true)
    await screenshot(page, 'photos-uploading')
    await expect
      .poll(() => page.locator('[data-testid="upload-item"][data-state="done"]').count(), {
        timeout: 40_000,
      })
      .toBe(2)
    await cdp.send('Network.emulateNetworkConditions', {
      offline: false,
      latency: 0,
      downloadThroughput: -1,
      uploadThroughput: -1,
    })
    await expect.poll(() => page.getByTestId('photo-tile').count()).toBe(2)

    // a file that is not an image is refused by its content, named, and offered a retry
    const notes = join(folder, 'notes.jpg')
    writeFileSync(notes, 'Crack found at the weld toe.\n')
    await page.getByTestId('photo-input').setInputFiles([notes])
    await expect.poll(() => page.getByTestId('upload-error').textContent()).toContain('notes.jpg')
    expect(await page.getByTestId('upload-retry').count()).toBe(1)
    expect(await page.getByTestId('photo-tile').count()).toBe(2)

    await page.getByTestId('photo-tile').first().click()
    const frame = page.getByTestId('photo-frame')
    await frame.waitFor()
    const box = (await frame.boundingBox()) as {
      x: number
      y: number
      width: number
      height: number
    }
    const at = (fx: number, fy: number) =>
      [box.x + box.width * fx, box.y + box.height * fy] as const
    async function drag(from: readonly [number, number], to: readonly [number, number]) {
      await page.mouse.move(...from)
      await page.mouse.down()
      await page.mouse.move(...to, { steps: 5 })
      await page.mouse.up()
    }

    // calibrate: a line over half the photo's width (450 original px) is 9 mm → 20 µm per px
    await page.getByTestId('tool-calibrate').click()
    await drag(at(0.25, 0.5), at(0.75, 0.5))
    await page.locator('#known-length').fill('9')
    await page.getByTestId('apply-calibration').click()
    await expect.poll(() => page.getByTestId('scale-bar-label').count()).toBe(1)
    // 900 px × 20 µm = 18 mm wide; a fifth is 3.6 mm → the 1-2-5 series gives 2 mm
    expect((await page.getByTestId('scale-bar-label').textContent())?.trim()).toBe('2 mm')

    await page.getByTestId('tool-arrow').click()
    await drag(at(0.2, 0.2), at(0.45, 0.4))
    await expect.poll(() => page.getByTestId('mark-arrow').count()).toBe(1)
    await page.getByTestId('tool-label').click()
    await page.mouse.click(...at(0.1, 0.15))
    await page.getByTestId('label-text').fill('Origin')
    await page.getByTestId('add-label').click()
    await expect.poll(() => page.getByTestId('mark-label').count()).toBe(1)
    await page.getByTestId('tool-label').click()

    // measuring with the calibration: a quarter of the width is 225 px × 20 µm = 4.5 mm
    await page.getByTestId('tool-measure').click()
    await page.mouse.move(...at(0.25, 0.8))
    await page.mouse.down()
    await page.mouse.move(...at(0.5, 0.8), { steps: 5 })
    await expect
      .poll(() => page.getByTestId('measured-length').textContent())
      .toMatch(/4\.[45]\d? mm/)
    await page.mouse.up()
    await screenshot(page, 'photos-marked')

    const [download] = await Promise.all([
      page.waitForEvent('download'),
      page.getByTestId('export-figure').click(),
    ])
    const figure = readFileSync((await download.path()) as string)
    const meta = await sharp(figure).metadata()
    expect([meta.format, meta.width, meta.height]).toEqual(['png', 900, 600])
    // the marks' yellow ink (#ffd400) is burnt into the figure
    const { data } = await sharp(figure).raw().toBuffer({ resolveWithObject: true })
    let yellow = 0
    for (let i = 0; i < data.length; i += meta.channels as number) {
      if (data[i]! > 230 && data[i + 1]! > 190 && data[i + 2]! < 60) yellow++
    }
    expect(yellow).toBeGreaterThan(100)

    // keyboard: → goes to the other photo, ← back, Esc closes
    const first = await page.getByTestId('viewer-title').textContent()
    await page.keyboard.press('ArrowRight')
    await expect.poll(() => page.getByTestId('viewer-title').textContent()).not.toBe(first)
    await page.keyboard.press('ArrowLeft')
    await expect.poll(() => page.getByTestId('viewer-title').textContent()).toBe(first)
    await page.keyboard.press('Escape')
    await expect.poll(() => page.getByTestId('photo-viewer').count()).toBe(0)
    const photoId = await page.evaluate(
      async (caseId) => {
        const answer = await fetch(`/api/cases/${caseId}/photos`)
        return ((await answer.json()) as { data: { id: number }[] }).data[0]!.id
      },
      Number(/cases\/(\d+)/.exec(caseUrl)?.[1]),
    )

    // a client of another organisation: not found by any URL
    await context.clearCookies()
    await signIn(page, base, 'client2@demo.test', inject('demoPassword'))
    for (const copy of ['original', 'display', 'thumbnail', 'figure']) {
      const answer = await page.goto(`${base}/api/photos/${photoId}/${copy}`)
      expect(answer?.status(), copy).toBe(404)
    }
    await page.goto(`${caseUrl}/evidence/photos`)
    await expect
      .poll(() => page.getByText('not found', { exact: false }).count())
      .toBeGreaterThan(0)
    await screenshot(page, 'photos-other-client')
    const expected = [
      { status: 401, path: '/auth/me' },
      { status: 415, path: `/cases/${/cases\/(\d+)/.exec(caseUrl)?.[1]}/photos` },
      ...['original', 'display', 'thumbnail', 'figure'].map((copy) => ({
        status: 404,
        path: `/photos/${photoId}/${copy}`,
      })),
      { status: 404, path: `/cases/${/cases\/(\d+)/.exec(caseUrl)?.[1]}` },
      { status: 404, path: `/cases/${/cases\/(\d+)/.exec(caseUrl)?.[1]}/photos` },
    ]
    expect(unexpectedErrors(browser().errors, expected)).toEqual([])
  })
})
