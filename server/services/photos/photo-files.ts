import type { FileStorage, StoredFile } from '../../storage/file-storage'
import { deriveCopies, type Derivatives } from './image-derivatives'

export interface PhotoFiles {
  copies: Derivatives
  original: StoredFile
  display: StoredFile
  thumbnail: StoredFile
}

/** Removes whichever of the files were stored. */
export const removeFiles = (storage: FileStorage, files: (StoredFile | undefined)[]) =>
  Promise.all(files.filter((file) => file !== undefined).map((file) => storage.remove(file.key)))

/**
 * Stores the original (copied and hashed while sharp decodes it, so the disk and the processor
 * work at once) and the derived display copy and thumbnail. All three are stored or none: a
 * refusal or a failure removes what was already written.
 */
export async function storePhotoFiles(
  storage: FileStorage,
  path: string,
  fileName: string,
  maxPixels?: number,
): Promise<PhotoFiles> {
  const [original, copies] = await Promise.allSettled([
    storage.putFile(path),
    deriveCopies(path, fileName, maxPixels),
  ])
  if (original.status === 'rejected' || copies.status === 'rejected') {
    await removeFiles(storage, [original.status === 'fulfilled' ? original.value : undefined])
    throw original.status === 'rejected'
      ? original.reason
      : (copies as PromiseRejectedResult).reason
  }
  const stored: StoredFile[] = []
  try {
    stored.push(await storage.put(copies.value.display.bytes))
    stored.push(await storage.put(copies.value.thumbnail))
  } catch (error) {
    await removeFiles(storage, [original.value, ...stored])
    throw error
  }
  const [display, thumbnail] = stored as [StoredFile, StoredFile]
  return { copies: copies.value, original: original.value, display, thumbnail }
}
