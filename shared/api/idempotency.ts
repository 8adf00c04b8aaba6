/** The header a client sends with a create it may send twice (a double click, a retry). */
export const IDEMPOTENCY_HEADER = 'Idempotency-Key'

/** Visible ASCII without spaces, 1 to 191 characters: a UUID or any random token. */
export const IDEMPOTENCY_KEY_PATTERN = /^[\x21-\x7e]{1,191}$/

function randomKey(): string {
  // getRandomValues, unlike randomUUID, also works on a plain-HTTP address in the lab's network
  const bytes = globalThis.crypto.getRandomValues(new Uint8Array(16))
  return Array.from(bytes, (byte) => byte.toString(16).padStart(2, '0')).join('')
}

/**
 * A key per distinct thing a form sends: sending the same again (a double click, a retry after
 * the answer was lost) reuses the key, so the server makes it only once and answers alike; once
 * anything in the form changed, the next send gets a new key.
 */
export function keyPerContent(): (value: unknown) => string {
  let last: { sent: string; key: string } | undefined
  return (value) => {
    const sent = JSON.stringify(value)
    if (last?.sent !== sent) last = { sent, key: randomKey() }
    return last.key
  }
}
