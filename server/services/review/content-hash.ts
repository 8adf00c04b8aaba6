import { createHash } from 'node:crypto'
import { canonicalJson } from '../../../shared/findings/canonical-json'

export const sha256Hex = (text: string | Buffer) => createHash('sha256').update(text).digest('hex')

/** SHA-256 of a value's canonical JSON: the fingerprint of "the exact content". */
export const contentSha256 = (value: unknown) => sha256Hex(canonicalJson(value))
