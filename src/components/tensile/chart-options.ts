import type { ChartOptions } from 'chart.js'

export type CurveView = 'engineering' | 'true'

export const CURVE_VIEWS: { label: string; value: CurveView }[] = [
  { label: 'Engineering', value: 'engineering' },
  { label: 'True (to maximum force)', value: 'true' },
]

/** Axes and behaviour shared by every stress–strain chart; `max` zooms to a window. */
export function stressStrainOptions(
  view: CurveView,
  max: { x?: number; y?: number } = {},
): ChartOptions<'scatter'> {
  const kind = view === 'true' ? 'True' : 'Engineering'
  return {
    animation: false,
    responsive: true,
    maintainAspectRatio: false,
    showLine: true,
    parsing: false,
    plugins: { legend: { position: 'bottom' } },
    scales: {
      x: {
        type: 'linear',
        min: 0,
        max: max.x,
        title: { display: true, text: `${kind} strain, %` },
      },
      y: { min: 0, max: max.y, title: { display: true, text: `${kind} stress, MPa` } },
    },
  }
}
