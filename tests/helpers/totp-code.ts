import { createHmac } from 'node:crypto'

// The tests' own RFC 4226/6238 code generator, independent of the package the server uses, and
// checked against the RFC 6238 Appendix B vectors in tests/unit/totp.test.ts.
const BASE32 = 'ABCDEFGHIJKLMNOPQRSTUVWXYZ234567'

export function base32Bytes(text: string): Buffer {
  let bits = ''
  for (const letter of text.replace(/=+$/, '').toUpperCase()) {
    const value = BASE32.indexOf(letter)
    if (value < 0) throw new Error(`not base32: ${letter}`)
    bits += value.toString(2).padStart(5, '0')
  }
  const bytes = bits.match(/.{8}/g) ?? []
  return Buffer.from(bytes.map((byte) => parseInt(byte, 2)))
}

export function base32Of(bytes: Buffer): string {
  const bits = [...bytes].map((byte) => byte.toString(2).padStart(8, '0')).join('')
  const groups = bits.match(/.{1,5}/g) ?? []
  return groups.map((group) => BASE32[parseInt(group.padEnd(5, '0'), 2)]).join('')
}

/** RFC 4226 section 5.3: HMAC, dynamic truncation, the low `digits` decimal digits. */
export function hotp(key: Buffer, counter: number, digits = 6, algorithm = 'sha1'): string {
  const message = Buffer.alloc(8)
  message.writeBigUInt64BE(BigInt(counter))
  const mac = createHmac(algorithm, key).update(message).digest()
  const offset = mac[mac.length - 1]! & 0x0f
  const binary = mac.readUInt32BE(offset) & 0x7fffffff
  return String(binary % 10 ** digits).padStart(digits, '0')
}

/** RFC 6238: the HOTP of the number of 30-second steps since the Unix epoch. */
export function totpCode(secretBase32: string, atMs = Date.now(), digits = 6): string {
  return hotp(base32Bytes(secretBase32), Math.floor(atMs / 30_000), digits)
}
