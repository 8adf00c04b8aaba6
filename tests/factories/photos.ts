import { expect } from 'vitest'
import type { ApiSession } from '../helpers/api-session'
import { plainJpeg } from './images'

/**
 * Adds a photograph to the case through the API as `session` (a plain JPEG unless `bytes` are
 * given) and answers its id; anything but 201 fails the test with the server's answer.
 */
export async function uploadPhoto(
  session: ApiSession,
  caseId: number,
  bytes?: Buffer,
  name = 'fracture.jpg',
): Promise<number> {
  const response = await session.agent
    .post(`/api/cases/${caseId}/photos`)
    .set('X-CSRF-Token', session.token)
    .attach('file', bytes ?? (await plainJpeg()), name)
  expect(response.status, JSON.stringify(response.body)).toBe(201)
  return response.body.data.id as number
}
