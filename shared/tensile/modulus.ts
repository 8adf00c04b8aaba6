import { TensileInputError } from './errors'
import { elasticCore, KNEE_SIGNIFICANCE, WINDOW_MIN_POINTS } from './elastic-core'
import { fitLine, type LineFit } from './linear-fit'
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
 * Settling (our own choice): the fit keeps samples within 0.2 % of the elastic strain of the
 * line; on a rounded curve, the top is cut back while the slope falls faster and faster by
 * more than 1 % beyond the scatter.
 */
const KNEE_TRIM = 0.01
const SETTLE_TOLERANCE = 0.002
const SETTLE_ROUNDS = 5

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
