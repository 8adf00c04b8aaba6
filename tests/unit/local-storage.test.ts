import { createHash } from 'node:crypto'
import { mkdtempSync, readdirSync, rmSync, writeFileSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { afterAll, describe, expect, it } from 'vitest'
import { AppError } from '../../server/errors'
import { createLocalStorage } from '../../server/storage/local-storage'

const root = mkdtempSync(join(tmpdir(), 'fractolog-storage-'))
afterAll(() => rmSync(root, { recursive: true, force: true }))

describe('local file storage', () => {
  const storage = createLocalStorage(root)
  const bytes = new TextEncoder().encode('fracture surface, origin at the thread root')

  it('names files itself and records the SHA-256 of the bytes (FIPS 180-4, via node:crypto)', async () => {
    const stored = await storage.put(bytes)
    expect(stored.key).toMatch(/^[0-9a-f]{2}\/[0-9a-f-]{36}$/)
    expect(stored.sha256).toBe(createHash('sha256').update(bytes).digest('hex'))
    expect(stored.size).toBe(bytes.byteLength)
    expect(Buffer.from(await storage.read(stored)).equals(Buffer.from(bytes))).toBe(true)
  })

  it('gives two uploads of the same bytes two keys and leaves no partial files', async () => {
    const first = await storage.put(bytes)
    const second = await storage.put(bytes)
    expect(first.key).not.toBe(second.key)
    const names = readdirSync(root, { recursive: true }).map(String)
    expect(names.some((name) => name.endsWith('.partial'))).toBe(false)
  })

  it('refuses to serve bytes that no longer match their fingerprint', async () => {
    const stored = await storage.put(bytes)
    writeFileSync(join(root, stored.key), 'altered')
    const reading = storage.read(stored)
    await expect(reading).rejects.toBeInstanceOf(AppError)
    await expect(reading).rejects.toMatchObject({ code: 'integrity_error', status: 500 })
  })

  it('accepts only its own keys, so no path can leave the folder', async () => {
    await expect(storage.read({ key: '../../etc/passwd', sha256: '' })).rejects.toThrow(
      /not a storage key/,
    )
    await storage.remove((await storage.put(bytes)).key)
  })
})
