import { fileTypeFromBuffer, fileTypeFromFile } from 'file-type'
import { AppError } from '../errors'

function refuse(accepted: readonly string[], detected: string | undefined, fileName?: string) {
  const which = fileName ? `“${fileName}” is` : 'This file is'
  return new AppError(
    'unsupported_file_type',
    `${which} not one of the accepted types (${accepted.join(', ')}).`,
    { detected: detected ?? null, ...(fileName ? { fileName } : {}) },
  )
}

/**
 * The media type of uploaded bytes, read from their content (magic numbers), never from the file
 * name or the type the browser claims; anything outside `accepted` is refused with 415.
 */
export async function recogniseType(
  bytes: Uint8Array,
  accepted: readonly string[],
): Promise<string> {
  const found = await fileTypeFromBuffer(bytes)
  if (!found || !accepted.includes(found.mime)) throw refuse(accepted, found?.mime)
  return found.mime
}

/** The same check for an upload held in a temporary file; `fileName` names it in the refusal. */
export async function recogniseFileType(
  path: string,
  accepted: readonly string[],
  fileName: string,
): Promise<string> {
  const found = await fileTypeFromFile(path)
  if (!found || !accepted.includes(found.mime)) throw refuse(accepted, found?.mime, fileName)
  return found.mime
}
