import { getActivePinia, getStores } from 'pinia'

/**
 * Puts every store in use back to its first state, so nothing of one person's session is left
 * for the next one. Setup stores implement `$reset` themselves.
 */
export function resetAllStores(): void {
  const pinia = getActivePinia()
  if (!pinia) return
  for (const store of getStores(pinia)) store.$reset()
}
