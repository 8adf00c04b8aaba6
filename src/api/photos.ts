import type { Photo, PhotoUpdate } from '../../shared/schemas/photos'
import { request } from './client'

export async function listPhotos(caseId: number, sampleId?: number): Promise<Photo[]> {
  const query = { sampleId }
  const { data } = await request<{ data: Photo[] }>('GET', `/cases/${caseId}/photos`, { query })
  return data
}

export async function uploadPhoto(
  caseId: number,
  file: File,
  onProgress: (share: number) => void,
): Promise<Photo> {
  const form = new FormData()
  form.append('file', file)
  const path = `/cases/${caseId}/photos`
  const options = { form, onUploadProgress: onProgress }
  const { data } = await request<{ data: Photo }>('POST', path, options)
  return data
}

export async function changePhoto(photoId: number, change: PhotoUpdate): Promise<Photo> {
  const { data } = await request<{ data: Photo }>('PATCH', `/photos/${photoId}`, { body: change })
  return data
}

/** Where the browser loads a photo's files (the API checks access on every request). */
export const photoUrl = (
  photoId: number,
  copy: 'original' | 'display' | 'thumbnail' | 'figure',
  version?: number,
) => `/api/photos/${photoId}/${copy}${copy === 'figure' && version ? `?v=${version}` : ''}`
