/** Ordinary least-squares line y = slope · x + intercept with its coefficient of determination. */
export interface LineFit {
  slope: number
  intercept: number
  rSquared: number
  points: number
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
  return { slope, intercept, rSquared, points: s.n }
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
  include: (index: number) => boolean = () => true,
): LineFit | null {
  const x0 = x[from] ?? 0
  const y0 = y[from] ?? 0
  const s: Sums = { n: 0, x: 0, y: 0, xx: 0, xy: 0, yy: 0 }
  for (let i = from; i <= to; i++) {
    if (!include(i)) continue
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
 * Running sums over a series so that the least-squares line of any index window costs O(1):
 * the window search for the elastic slope looks at every start index of a long record.
 */
export class WindowFitter {
  private readonly sums: Float64Array[]
  private readonly x0: number
  private readonly y0: number

  constructor(x: ArrayLike<number>, y: ArrayLike<number>, length: number) {
    this.x0 = x[0] ?? 0
    this.y0 = y[0] ?? 0
    this.sums = [0, 1, 2, 3, 4].map(() => new Float64Array(length + 1))
    const [sx, sy, sxx, sxy, syy] = this.sums as [
      Float64Array,
      Float64Array,
      Float64Array,
      Float64Array,
      Float64Array,
    ]
    for (let i = 0; i < length; i++) {
      const dx = x[i]! - this.x0
      const dy = y[i]! - this.y0
      sx[i + 1] = sx[i]! + dx
      sy[i + 1] = sy[i]! + dy
      sxx[i + 1] = sxx[i]! + dx * dx
      sxy[i + 1] = sxy[i]! + dx * dy
      syy[i + 1] = syy[i]! + dy * dy
    }
  }

  /** The line through samples from..to inclusive. */
  fit(from: number, to: number): LineFit {
    const window = (k: number) => this.sums[k]![to + 1]! - this.sums[k]![from]!
    const line = lineFromSums({
      n: to - from + 1,
      x: window(0),
      y: window(1),
      xx: window(2),
      xy: window(3),
      yy: window(4),
    })
    return { ...line, intercept: this.y0 + line.intercept - line.slope * this.x0 }
  }
}
