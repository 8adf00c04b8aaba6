/** The facts an evidence entry of the activity shows: which item or observation, and why. */
export function evidenceFacts(details: Record<string, unknown>): string[] {
  const facts: string[] = []
  if (typeof details.itemId === 'string') facts.push(`Item ${details.itemId}`)
  if (typeof details.number === 'string' && details.observationId) facts.push(details.number)
  if (typeof details.answer === 'string') facts.push(`Answer: ${details.answer.replace('_', ' ')}`)
  if (typeof details.from === 'string' && typeof details.to === 'string' && details.eventId) {
    facts.push(`${details.from} → ${details.to}`)
  }
  for (const key of ['reason', 'resolution'] as const) {
    if (typeof details[key] === 'string')
      facts.push(`${key === 'reason' ? 'Reason' : 'Resolution'}: ${details[key]}`)
  }
  return facts
}
