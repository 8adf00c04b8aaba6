import { fileTypeFromBuffer } from 'file-type'
import { AppError } from '../errors'

/**
 * The media type of uploaded bytes, read from their content (magic numbers), never from the file
 * name or the type the browser claims; anything outside `accepted` is refused with 415.
 */
export async function recogniseType(
  bytes: Uint8Array,
  accepted: readonly string[],
): Promise<string> {
  const found = await fileTypeFromBuffer(bytes)
  if (!found || !accepted.includes(found.mime)) {
    throw new AppError(
      'unsupported_file_type',
      `This file is not one of the accepted types (${accepted.join(', ')}).`,
      { detected: found?.mime ?? null },
    )
  }
  return found.mime
}
