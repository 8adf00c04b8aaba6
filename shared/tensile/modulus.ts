import { TensileInputError } from './errors'
import { BlockFitter, fitLine, type LineFit } from './linear-fit'
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
  /** How the window was found: searched by the engine, or the fit range the user gave. */
  chosenBy: 'automatic' | 'fit range'
  /** The search found no sharp end to the linear part and fitted the straight start instead. */
  rounded: boolean
}

/*
 * Window search settings (our own choice, tuned on the open 42CrMoS4 records and on
 * Ramberg–Osgood curves with n from 5 to 25): a candidate window spans a fraction of the peak
 * stress and at least 8 samples; it is straight when the slopes of its halves differ by at most
 * 2 %. A curve whose straightest window still bends, beyond its scatter, by more than 1 % has no
 * sharp end to its linear part (austenitic stainless steels, many aluminium alloys), so the
 * search halves the span, down to 1/64 of the peak stress, until it finds the straight start.
 * The settled fit keeps samples within 0.2 % of the elastic strain of the line. The running
 * sums are kept per block so that about 4000 window starts cover any record.
 */
const SPAN_FRACTIONS = [1 / 4, 1 / 8, 1 / 16, 1 / 32, 1 / 64]
const WINDOW_MIN_POINTS = 8
const MAX_BEND = 0.02
const KNEE_SIGNIFICANCE = 3
const KNEE_TRIM = 0.01
const SETTLE_TOLERANCE = 0.002
const SETTLE_ROUNDS = 5
const MAX_WINDOW_STARTS = 4000

interface Window {
  from: number
  to: number
  line: LineFit
  /** Largest difference between the slopes of the window's thirds, relative to its slope. */
  bend: number
  /** How much flatter the upper third is than the middle one, relative to the slope. */
  knee: number
  /** Standard error of the knee from the scatter of the two thirds. */
  kneeError: number
}

/*
 * Thirds, not halves: a window that starts in a toe and ends in the rounding into yield has a
 * flat lower and a flat upper part, which two halves can balance into a false straight line.
 */
function windowOf(fitter: BlockFitter, fromBlock: number, toBlock: number): Window {
  const first = fromBlock + Math.floor((toBlock - fromBlock) / 3)
  const second = fromBlock + Math.floor((2 * (toBlock - fromBlock)) / 3)
  const line = fitter.fit(fromBlock, toBlock)
  const [lower, middle, upper] = [
    fitter.fit(fromBlock, first),
    fitter.fit(first, second),
    fitter.fit(second, toBlock),
  ]
  const slopes = [lower.slope, middle.slope, upper.slope]
  return {
    from: fitter.start(fromBlock),
    to: fitter.start(toBlock) - 1,
    line,
    bend: (Math.max(...slopes) - Math.min(...slopes)) / Math.abs(line.slope),
    knee: (middle.slope - upper.slope) / Math.abs(line.slope),
    kneeError: Math.hypot(middle.slopeError, upper.slopeError) / Math.abs(line.slope),
  }
}

/** Windows over the rising curve, one per start block, each spanning `span` MPa of stress. */
function candidateWindows(fitter: BlockFitter, stress: Float64Array, span: number): Window[] {
  const windows: Window[] = []
  const minBlocks = Math.max(3, Math.ceil(WINDOW_MIN_POINTS / fitter.stride))
  let toBlock = 0
  for (let fromBlock = 0; fromBlock < fitter.blocks; fromBlock++) {
    const base = stress[fitter.start(fromBlock)]!
    toBlock = Math.max(toBlock, fromBlock + minBlocks)
    while (toBlock <= fitter.blocks && stress[fitter.start(toBlock) - 1]! < base + span) toBlock++
    if (toBlock > fitter.blocks) break
    windows.push(windowOf(fitter, fromBlock, toBlock))
  }
  return windows
}

/**
 * The steepest of the straight windows. Straight is judged by how much the slope changes from
 * the lower to the upper half of a window, which rejects both a toe and a stiff seating
 * transient at the start of a record as well as the rounding into yield.
 */
function steepestStraight(windows: readonly Window[]): Window {
  let leastBend = Number.POSITIVE_INFINITY
  for (const w of windows) if (w.line.slope > 0) leastBend = Math.min(leastBend, w.bend)
  const limit = Math.max(MAX_BEND, leastBend * 2)
  let best = windows[0]!
  for (const w of windows) {
    if (w.bend > limit || !(w.line.slope > 0)) continue
    if (!(best.line.slope > 0) || best.bend > limit || w.line.slope > best.line.slope) best = w
  }
  return best
}

/** Rounded: not straight, and the top third flatter than the middle, beyond the scatter. */
function isRounded(window: Window): boolean {
  return window.bend > MAX_BEND && window.knee > KNEE_SIGNIFICANCE * window.kneeError
}

/**
 * The straight core of the elastic part, searched at ever finer spans while the curve is
 * rounded; `rounded` says the coarsest span found no sharp linear part.
 */
function elasticCore(strain: Float64Array, stress: Float64Array, peak: number) {
  const stride = Math.max(1, Math.ceil((peak + 1) / MAX_WINDOW_STARTS))
  const fitter = new BlockFitter(strain, stress, peak + 1, stride)
  let core: Window | null = null
  let rounded = false
  for (const fraction of SPAN_FRACTIONS) {
    const windows = candidateWindows(fitter, stress, fraction * stress[peak]!)
    if (windows.length === 0) break
    core = steepestStraight(windows)
    if (!isRounded(core)) break
    rounded = true
  }
  return core === null ? null : { core, rounded }
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

/**
 * How much faster the slope falls from the middle to the upper third than from the lower to
 * the middle one, relative to the slope, with its standard error. The rounding into yield
 * falls faster and faster; a stiff seating transient at the start falls and then levels off.
 */
function fallingFaster(strain: Float64Array, stress: Float64Array, from: number, to: number) {
  const length = to - from + 1
  const first = from + Math.floor(length / 3)
  const second = from + Math.floor((2 * length) / 3)
  const thirds = [
    fitLine(strain, stress, from, first - 1),
    fitLine(strain, stress, first, second - 1),
    fitLine(strain, stress, second, to),
  ]
  const [lower, middle, upper] = thirds
  if (lower == null || middle == null || upper == null)
    return { knee: 0, acceleration: 0, error: Number.POSITIVE_INFINITY }
  const scale = Math.abs(middle.slope)
  return {
    knee: (middle.slope - upper.slope) / scale,
    acceleration: (2 * middle.slope - lower.slope - upper.slope) / scale,
    error: Math.hypot(lower.slopeError, 2 * middle.slopeError, upper.slopeError) / scale,
  }
}

/**
 * Settling grows the window as far as the scatter allows, which on a noisy rounded curve
 * reaches into the rounding: the top is cut back while the slope of the window falls faster
 * and faster, beyond the scatter.
 */
function withoutKnee(strain: Float64Array, stress: Float64Array, from: number, to: number): number {
  while (to - from + 1 > 2 * WINDOW_MIN_POINTS) {
    const { knee, acceleration, error } = fallingFaster(strain, stress, from, to)
    if (!(knee > KNEE_TRIM && acceleration > KNEE_SIGNIFICANCE * error)) break
    to -= Math.max(1, Math.floor((to - from + 1) * 0.1))
  }
  return to
}

function toModulusFit(
  stress: Float64Array,
  [from, to]: [number, number],
  line: LineFit,
  how: Pick<ModulusFit, 'chosenBy' | 'rounded'>,
): ModulusFit {
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
    ...how,
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
  const found = elasticCore(strain, stress, peak)
  if (found === null) {
    throw new TensileInputError('Too few points before maximum force to fit the elastic slope')
  }
  const [from, settledTo] = settledRange(strain, stress, peak, found.core.from, found.core.to)
  const to = found.rounded ? withoutKnee(strain, stress, from, settledTo) : settledTo
  const line = fitLine(strain, stress, from, to)
  if (line === null || !(line.slope > 0))
    throw new TensileInputError('No rising elastic part found')
  return toModulusFit(stress, [from, to], line, { chosenBy: 'automatic', rounded: found.rounded })
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
  return toModulusFit(stress, [from!, to!], line, { chosenBy: 'fit range', rounded: false })
}
