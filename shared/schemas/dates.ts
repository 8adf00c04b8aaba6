/** The earliest and latest years a date in a case may carry (old parts, far-off due dates). */
export const FIRST_YEAR = 1800
export const LAST_YEAR = 2200

const ISO_DAY = /^(\d{4})-(\d{2})-(\d{2})$/

/** Whether `text` is a real calendar day written YYYY-MM-DD within the years above. */
export function isCalendarDay(text: string): boolean {
  const match = ISO_DAY.exec(text)
  if (!match) return false
  const [year, month, day] = [Number(match[1]), Number(match[2]), Number(match[3])]
  if (year < FIRST_YEAR || year > LAST_YEAR || month < 1 || month > 12 || day < 1) return false
  const date = new Date(Date.UTC(year, month - 1, day))
  return date.getUTCMonth() === month - 1 && date.getUTCDate() === day
}

/** Today's calendar day in UTC, as YYYY-MM-DD. */
export function todayIso(now: Date = new Date()): string {
  return now.toISOString().slice(0, 10)
}
