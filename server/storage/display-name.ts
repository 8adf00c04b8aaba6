/** A safe name to show and offer for download: no path, no control characters. */
export function displayName(original: string, fallback = 'document'): string {
  const base = original.split(/[\\/]/).pop() ?? ''
  const clean = base.replace(/[\p{Cc}\p{Cf}"]/gu, '').trim()
  return (clean || fallback).slice(0, 191)
}
