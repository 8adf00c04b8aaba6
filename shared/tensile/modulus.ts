import { TensileInputError } from './errors'
import { fitLine, WindowFitter, type LineFit } from './linear-fit'
import type { FitRange } from './types'

/** The elastic line of the test and the samples it was fitted to. */
export interface ModulusFit {
  modulusMPa: number
  interceptMPa: number
  fromIndex: number
  toIndex: number
  fromMPa: number
  toMPa: number
  rSquared: number
  points: number
}

/*
 * Window search settings (our own choice, tuned on the open 42CrMoS4 records and on
 * Ramberg–Osgood curves): a candidate window spans a quarter of the peak stress and at least
 * 8 samples; it is straight when the slopes of its halves differ by at most 2 %; the settled
 * fit keeps samples within 0.2 % of the elastic strain of the line. At most about 4000 start
 * positions are tried, so a million-point record costs no more than a small one.
 */
const WINDOW_SPAN = 0.25
const WINDOW_MIN_POINTS = 8
const MAX_BEND = 0.02
const SETTLE_TOLERANCE = 0.002
const SETTLE_ROUNDS = 5
const MAX_WINDOW_STARTS = 4000

interface Window {
  from: number
  to: number
  line: LineFit
  /** Relative difference between the slopes of the window's two halves. */
  bend: number
}

function candidateWindows(strain: Float64Array, stress: Float64Array, peak: number): Window[] {
  const fitter = new WindowFitter(strain, stress, peak + 1)
  const span = WINDOW_SPAN * stress[peak]!
  const windows: Window[] = []
  const step = Math.max(1, Math.floor(peak / MAX_WINDOW_STARTS))
  let to = 0
  for (let from = 0; from <= peak; from += step) {
    to = Math.max(to, from + WINDOW_MIN_POINTS - 1)
    while (to <= peak && stress[to]! < stress[from]! + span) to++
    if (to > peak) break
    const middle = Math.floor((from + to) / 2)
    const line = fitter.fit(from, to)
    const bend =
      Math.abs(fitter.fit(from, middle).slope - fitter.fit(middle, to).slope) / line.slope
    windows.push({ from, to, line, bend })
  }
  return windows
}

/**
 * The steepest of the straight windows. Straight is judged by how much the slope changes from
 * the lower to the upper half of a window, which rejects both a toe and a stiff seating
 * transient at the start of a record as well as the rounding into yield.
 */
function steepestStraight(windows: readonly Window[]): number {
  let leastBend = Number.POSITIVE_INFINITY
  for (const w of windows) if (w.line.slope > 0) leastBend = Math.min(leastBend, w.bend)
  const limit = Math.max(MAX_BEND, leastBend * 2)
  let best = -1
  for (let k = 0; k < windows.length; k++) {
    const w = windows[k]!
    if (w.bend > limit || !(w.line.slope > 0)) continue
    if (best < 0 || w.line.slope > windows[best]!.line.slope) best = k
  }
  return Math.max(best, 0)
}

function strainResidual(
  strain: Float64Array,
  stress: Float64Array,
  line: LineFit,
  i: number,
): number {
  return Math.abs(strain[i]! - (stress[i]! - line.intercept) / line.slope)
}

/** Scatter of the samples about the line, in strain, so growth is not stopped by noise. */
function residualSpread(
  strain: Float64Array,
  stress: Float64Array,
  line: LineFit,
  from: number,
  to: number,
): number {
  let sum = 0
  for (let i = from; i <= to; i++) sum += strainResidual(strain, stress, line, i) ** 2
  return Math.sqrt(sum / Math.max(1, to - from - 1))
}

/**
 * Settles the window on the linear part around the chosen one: the run of samples around its
 * middle that stay on the fitted line, refitted until it stops changing. "On the line" means
 * within a small fraction of the elastic strain at the top of the window (or four times the
 * scatter of a noisy record), so the fit covers the whole straight stretch, not only its
 * stiffest piece, and stops before the rounding into yield.
 */
function settledRange(
  strain: Float64Array,
  stress: Float64Array,
  peak: number,
  from: number,
  to: number,
): [number, number] {
  const centre = Math.floor((from + to) / 2)
  for (let round = 0; round < SETTLE_ROUNDS; round++) {
    const line = fitLine(strain, stress, from, to)
    if (line === null) break
    const top = stress[to]! / line.slope
    const tolerance = Math.max(
      SETTLE_TOLERANCE * top,
      4 * residualSpread(strain, stress, line, from, to),
    )
    const fits = (i: number) => strainResidual(strain, stress, line, i) <= tolerance
    let newFrom = centre
    let newTo = centre
    while (newTo < peak && fits(newTo + 1)) newTo++
    while (newFrom > 0 && fits(newFrom - 1)) newFrom--
    if (newTo - newFrom + 1 < WINDOW_MIN_POINTS || (newFrom === from && newTo === to)) break
    ;[from, to] = [newFrom, newTo]
  }
  return [from, to]
}

function toModulusFit(stress: Float64Array, from: number, to: number, line: LineFit): ModulusFit {
  let low = Number.POSITIVE_INFINITY
  let high = Number.NEGATIVE_INFINITY
  for (let i = from; i <= to; i++) {
    low = Math.min(low, stress[i]!)
    high = Math.max(high, stress[i]!)
  }
  return {
    modulusMPa: line.slope,
    interceptMPa: line.intercept,
    fromIndex: from,
    toIndex: to,
    fromMPa: low,
    toMPa: high,
    rSquared: line.rSquared,
    points: line.points,
  }
}

/**
 * Elastic slope by least squares over the linear part (ASTM E111, least-squares method). The
 * window is searched, not fixed: the steepest straight stretch of the rising curve before
 * maximum force, so a toe at the start and the rounding into yield are both left out.
 */
export function fitModulusAutomatically(
  strain: Float64Array,
  stress: Float64Array,
  peak: number,
): ModulusFit {
  const windows = candidateWindows(strain, stress, peak)
  if (windows.length === 0) {
    throw new TensileInputError('Too few points before maximum force to fit the elastic slope')
  }
  const core = windows[steepestStraight(windows)]!
  const [from, to] = settledRange(strain, stress, peak, core.from, core.to)
  const line = fitLine(strain, stress, from, to)
  if (line === null || !(line.slope > 0))
    throw new TensileInputError('No rising elastic part found')
  return toModulusFit(stress, from, to, line)
}

/** Elastic slope over a range the user chose (ASTM E111), on the rising curve before maximum force. */
export function fitModulusInRange(
  strain: Float64Array,
  stress: Float64Array,
  peak: number,
  range: FitRange,
): ModulusFit {
  const inRange =
    range.quantity === 'stress'
      ? (i: number) => stress[i]! >= range.fromMPa && stress[i]! <= range.toMPa
      : (i: number) => strain[i]! >= range.from && strain[i]! <= range.to
  const indices = Array.from({ length: peak + 1 }, (_, i) => i).filter(inRange)
  const from = indices[0]
  const to = indices.at(-1)
  const line =
    from === undefined || to === undefined ? null : fitLine(strain, stress, from, to, inRange)
  if (line === null || line.points < 3 || !(line.slope > 0)) {
    throw new TensileInputError('The fit range holds fewer than 3 points of the rising curve')
  }
  return toModulusFit(stress, from!, to!, line)
}
