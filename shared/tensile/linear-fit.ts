/** Ordinary least-squares line y = slope · x + intercept with its coefficient of determination. */
export interface LineFit {
  slope: number
  intercept: number
  rSquared: number
  points: number
  /** Standard error of the slope from the scatter about the line (infinite below 3 points). */
  slopeError: number
}

interface Sums {
  n: number
  x: number
  y: number
  xx: number
  xy: number
  yy: number
}

function lineFromSums(s: Sums): LineFit {
  const sxx = s.xx - (s.x * s.x) / s.n
  const sxy = s.xy - (s.x * s.y) / s.n
  const syy = s.yy - (s.y * s.y) / s.n
  const slope = sxy / sxx
  const intercept = (s.y - slope * s.x) / s.n
  const rSquared = syy > 0 ? (sxy * sxy) / (sxx * syy) : 1
  const residual = Math.max(0, syy - slope * sxy)
  const slopeError = s.n > 2 ? Math.sqrt(residual / (s.n - 2) / sxx) : Number.POSITIVE_INFINITY
  return { slope, intercept, rSquared, points: s.n, slopeError }
}

/**
 * Sums for a least-squares line built one point at a time, shifted by the first point so that
 * large offsets do not eat the precision of the sums.
 */
export class LineSums {
  private readonly s: Sums = { n: 0, x: 0, y: 0, xx: 0, xy: 0, yy: 0 }
  private x0 = 0
  private y0 = 0

  add(x: number, y: number): void {
    const s = this.s
    if (s.n === 0) [this.x0, this.y0] = [x, y]
    const dx = x - this.x0
    const dy = y - this.y0
    s.n++
    s.x += dx
    s.y += dy
    s.xx += dx * dx
    s.xy += dx * dy
    s.yy += dy * dy
  }

  /** The line, or null with fewer than two points or no spread in x. */
  line(): LineFit | null {
    if (this.s.n < 2) return null
    const line = lineFromSums(this.s)
    if (!Number.isFinite(line.slope)) return null
    return { ...line, intercept: this.y0 + line.intercept - line.slope * this.x0 }
  }
}

/**
 * Least squares over the samples whose index passes `include`, between `from` and `to`
 * inclusive. The values are shifted by the first sample before summing so that large offsets
 * do not eat the precision of the sums.
 */
export function fitLine(
  x: ArrayLike<number>,
  y: ArrayLike<number>,
  from: number,
  to: number,
  include?: (index: number) => boolean,
): LineFit | null {
  const x0 = x[from] ?? 0
  const y0 = y[from] ?? 0
  const s: Sums = { n: 0, x: 0, y: 0, xx: 0, xy: 0, yy: 0 }
  for (let i = from; i <= to; i++) {
    if (include !== undefined && !include(i)) continue
    const dx = x[i]! - x0
    const dy = y[i]! - y0
    s.n++
    s.x += dx
    s.y += dy
    s.xx += dx * dx
    s.xy += dx * dy
    s.yy += dy * dy
  }
  if (s.n < 2) return null
  const line = lineFromSums(s)
  if (!Number.isFinite(line.slope)) return null
  return { ...line, intercept: y0 + line.intercept - line.slope * x0 }
}

/**
 * Running sums over a series, kept at the boundaries of blocks of `stride` samples, so that
 * the least-squares line over any run of whole blocks costs O(1) and the sums of a long record
 * take little memory: the window search for the elastic slope looks at thousands of windows.
 */
export class BlockFitter {
  /** Number of blocks; the last may be shorter than `stride`. */
  readonly blocks: number
  private readonly sums: Float64Array[]
  private readonly x0: number
  private readonly y0: number

  constructor(
    x: ArrayLike<number>,
    y: ArrayLike<number>,
    private readonly length: number,
    readonly stride: number,
  ) {
    this.x0 = x[0] ?? 0
    this.y0 = y[0] ?? 0
    this.blocks = Math.ceil(length / stride)
    this.sums = [0, 1, 2, 3, 4].map(() => new Float64Array(this.blocks + 1))
    const running = [0, 0, 0, 0, 0]
    for (let i = 0; i < length; i++) {
      const dx = x[i]! - this.x0
      const dy = y[i]! - this.y0
      running[0]! += dx
      running[1]! += dy
      running[2]! += dx * dx
      running[3]! += dx * dy
      running[4]! += dy * dy
      if ((i + 1) % stride === 0 || i + 1 === length) {
        const block = Math.ceil((i + 1) / stride)
        for (let k = 0; k < 5; k++) this.sums[k]![block] = running[k]!
      }
    }
  }

  /** First sample of a block (or the end of the series for `blocks`). */
  start(block: number): number {
    return Math.min(block * this.stride, this.length)
  }

  /** The line through the samples of blocks from..to − 1. */
  fit(fromBlock: number, toBlock: number): LineFit {
    const window = (k: number) => this.sums[k]![toBlock]! - this.sums[k]![fromBlock]!
    const line = lineFromSums({
      n: this.start(toBlock) - this.start(fromBlock),
      x: window(0),
      y: window(1),
      xx: window(2),
      xy: window(3),
      yy: window(4),
    })
    return { ...line, intercept: this.y0 + line.intercept - line.slope * this.x0 }
  }
}
