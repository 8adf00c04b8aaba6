import type { ChartDataset } from 'chart.js'
import type { CurvePoint } from '../../../shared/tensile'
import { hollomonLine, trueCurve, type TrueCurveInput } from '../../../shared/tensile/true-view'

type Line = ChartDataset<'scatter', CurvePoint[]>

export function trueLines(curve: readonly CurvePoint[], r: TrueCurveInput): Line[] {
  const lines: Line[] = [
    {
      label: 'True stress–true strain (to maximum force)',
      data: trueCurve(curve, r),
      borderColor: '#1d5f74',
      backgroundColor: '#1d5f74',
      borderWidth: 1.5,
      pointRadius: 0,
      showLine: true,
    },
  ]
  const fit = hollomonLine(r)
  if (fit.length)
    lines.push({
      label: `Hollomon fit σ = ${r.strengthCoefficientMPa?.toFixed(0)}·ε^${r.strainHardeningExponent?.toFixed(3)} MPa`,
      data: fit,
      borderColor: '#c0392b',
      backgroundColor: '#c0392b',
      borderWidth: 1.5,
      borderDash: [6, 4],
      pointRadius: 0,
      showLine: true,
    })
  lines.push({
    label: 'Maximum force (true values)',
    data: [{ x: r.trueStrainAtMaxForce * 100, y: r.trueStressAtMaxForceMPa }],
    borderColor: '#7a2e0e',
    backgroundColor: '#7a2e0e',
    pointRadius: 5,
    pointStyle: 'rectRot',
    showLine: false,
  })
  return lines
}
