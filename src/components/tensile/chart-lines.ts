import type { ChartDataset } from 'chart.js'
import type { CurvePoint, SpecimenResult } from '../../../shared/tensile'

type Line = ChartDataset<'scatter', CurvePoint[]>

const line = (label: string, data: CurvePoint[], color: string, dash: number[] = []): Line => ({
  label,
  data,
  borderColor: color,
  backgroundColor: color,
  borderWidth: 1.5,
  borderDash: dash,
  pointRadius: 0,
  showLine: true,
})

/** Strain (%) on the recorded axis where the elastic line through the shifted origin reaches `stress`. */
const onElasticLine = (r: SpecimenResult, stress: number, offsetPct = 0) =>
  r.strainOriginShiftPct + offsetPct + stress / (r.modulusGPa * 10)

function markedPoints(r: SpecimenResult, curve: CurvePoint[]): Line {
  const points: (CurvePoint & { name: string })[] = []
  const add = (name: string, x: number, y: number | null) => {
    if (y !== null && Number.isFinite(x)) points.push({ name, x, y })
  }
  if (r.proportionalLimitMPa !== null)
    add('Proportional limit', onElasticLine(r, r.proportionalLimitMPa), r.proportionalLimitMPa)
  if (r.yieldStrengthMPa !== null)
    add(`Rp${r.offsetPct}`, onElasticLine(r, r.yieldStrengthMPa, r.offsetPct), r.yieldStrengthMPa)
  const nearest = (stress: number | null) =>
    stress === null
      ? null
      : curve.reduce((a, b) => (Math.abs(b.y - stress) < Math.abs(a.y - stress) ? b : a))
  const upper = nearest(r.upperYieldMPa)
  if (upper) add('ReH', upper.x, r.upperYieldMPa)
  const lower = nearest(r.lowerYieldMPa)
  if (lower) add('ReL', lower.x, r.lowerYieldMPa)
  add('Rm', r.totalElongationAtMaxForcePct + r.strainOriginShiftPct, r.tensileStrengthMPa)
  const last = curve.at(-1)
  if (last) add('Fracture', last.x, last.y)
  return {
    label: 'Marked points',
    data: points,
    borderColor: '#7a2e0e',
    backgroundColor: '#7a2e0e',
    pointRadius: 5,
    pointStyle: 'rectRot',
    showLine: false,
  }
}

/** Horizontal lines at the specification's minimum yield and tensile limits, where compared. */
function limitLines(r: SpecimenResult, xMax: number): Line[] {
  const items = r.conformity?.items ?? []
  return items
    .filter((item) => /^(R|Rp|ReH|ReL|Rt)/.test(item.property))
    .map((item) =>
      line(
        `${item.property} ${item.bound === 'min' ? 'minimum' : 'maximum'} (specification)`,
        [
          { x: 0, y: item.limit },
          { x: xMax, y: item.limit },
        ],
        '#5b6770',
        [2, 4],
      ),
    )
}

/**
 * The datasets of the stress–strain chart: the curve, the modulus fit line over the window the
 * engine used, the offset line, the marked points and the specification's limits.
 */
export function chartLines(curve: CurvePoint[], r: SpecimenResult | null): Line[] {
  const lines = [line('Engineering stress–strain', curve, '#1d5f74')]
  if (!r) return lines
  const top = r.yieldStrengthMPa ?? r.tensileStrengthMPa
  lines.push(
    line(
      `Modulus fit (${r.modulusFit.fromMPa.toFixed(0)}–${r.modulusFit.toMPa.toFixed(0)} MPa)`,
      [
        { x: onElasticLine(r, 0), y: 0 },
        { x: onElasticLine(r, top), y: top },
      ],
      '#c0392b',
    ),
  )
  if (r.yieldStrengthMPa !== null)
    lines.push(
      line(
        `Offset line ${r.offsetPct} %`,
        [
          { x: onElasticLine(r, 0, r.offsetPct), y: 0 },
          { x: onElasticLine(r, r.yieldStrengthMPa, r.offsetPct), y: r.yieldStrengthMPa },
        ],
        '#c0392b',
        [6, 4],
      ),
    )
  lines.push(markedPoints(r, curve))
  return [...lines, ...limitLines(r, curve.at(-1)?.x ?? 1)]
}
