import { ref, type Ref } from 'vue'
import { uploadPhoto } from '@/api/photos'
import { ApiError } from '@/api/client'
import type { Photo } from '../../shared/schemas/photos'

export interface UploadItem {
  key: number
  file: File
  /** 0…1 of the file sent */
  progress: number
  state: 'waiting' | 'sending' | 'done' | 'failed'
  error: string | null
}

/** Files sent at once; the rest wait their turn (common practice for browser uploads). */
const PARALLEL = 3

/**
 * Sends dropped or chosen images one file per request, a few at a time, each with its progress;
 * a failed one can be sent again. `added` hears each photo the server kept.
 */
export function usePhotoUploads(caseId: Ref<number>, added: (photo: Photo) => void) {
  const items = ref<UploadItem[]>([])
  let nextKey = 1

  const sending = () => items.value.filter((item) => item.state === 'sending').length

  async function send(item: UploadItem): Promise<void> {
    item.state = 'sending'
    item.progress = 0
    item.error = null
    try {
      const photo = await uploadPhoto(caseId.value, item.file, (share) => (item.progress = share))
      item.progress = 1
      item.state = 'done'
      added(photo)
    } catch (error) {
      item.state = 'failed'
      item.error = error instanceof ApiError ? error.message : 'The upload failed.'
    } finally {
      pump()
    }
  }

  function pump(): void {
    for (const item of items.value) {
      if (sending() >= PARALLEL) return
      if (item.state === 'waiting') void send(item)
    }
  }

  function add(files: Iterable<File>): void {
    for (const file of files) {
      items.value.push({ key: nextKey++, file, progress: 0, state: 'waiting', error: null })
    }
    // work on the reactive copies, so progress shows as it changes
    pump()
  }

  function retry(item: UploadItem): void {
    item.state = 'waiting'
    pump()
  }

  function clearDone(): void {
    items.value = items.value.filter((item) => item.state !== 'done')
  }

  return { items, add, retry, clearDone }
}
