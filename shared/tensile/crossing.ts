/**
 * Walks from `from` to `to` and returns the first point where `level(i)` reaches `target`,
 * interpolating the stress linearly between the two samples that bracket it (the standards
 * read properties off the curve between samples). Null when the level is never reached.
 */
export function firstCrossing(
  stress: Float64Array,
  level: (i: number) => number,
  target: number,
  from: number,
  to: number,
): { stressMPa: number; index: number } | null {
  let previous = level(from)
  if (previous >= target) return { stressMPa: stress[from]!, index: from }
  for (let i = from + 1; i <= to; i++) {
    const current = level(i)
    if (current >= target) {
      const t = (target - previous) / (current - previous)
      return { stressMPa: stress[i - 1]! + t * (stress[i]! - stress[i - 1]!), index: i }
    }
    previous = current
  }
  return null
}
