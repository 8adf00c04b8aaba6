import { BlockFitter, type LineFit } from './linear-fit'

/*
 * Search for the straight core of the elastic part (settings our own choice, tuned on the open
 * 42CrMoS4 records and on Ramberg–Osgood curves with n from 5 to 25): a candidate window spans
 * a fraction of the peak stress and at least 8 samples; it is straight when the slopes of its
 * thirds differ by at most 2 %. A curve whose straightest window still bends, and whose top
 * third is flatter than its middle beyond the scatter, has no sharp end to its linear part
 * (austenitic stainless steels, many aluminium alloys), so the search halves the span, down to
 * 1/64 of the peak stress, until it finds the straight start. The running sums are kept per
 * block so that about 4000 window starts cover any record.
 */
const SPAN_FRACTIONS = [1 / 4, 1 / 8, 1 / 16, 1 / 32, 1 / 64]
export const WINDOW_MIN_POINTS = 8
const MAX_BEND = 0.02
export const KNEE_SIGNIFICANCE = 3
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
export function elasticCore(strain: Float64Array, stress: Float64Array, peak: number) {
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
