import { ref, type Ref } from 'vue'
import { pixelDistance, type Point } from '../../shared/photos/scale'
import type { Mark } from '../../shared/schemas/photos'

export type DrawingTool = 'arrow' | 'circle' | 'outline' | 'label' | 'calibrate' | 'measure'

/** Below this many original pixels a drag counts as a click (common practice for pointers). */
const CLICK = 4

/**
 * Turns pointer gestures over a photo into marks in the original's pixels: drag for arrows,
 * circles, calibration and measuring lines; click for labels and outline corners.
 */
export function useMarkDrawing(
  frame: Ref<HTMLElement | undefined>,
  size: () => { width: number; height: number },
  done: (result: {
    tool: DrawingTool
    mark?: Mark
    line?: { from: Point; to: Point }
    at?: Point
  }) => void,
) {
  const tool = ref<DrawingTool | null>(null)
  const line = ref<{ from: Point; to: Point } | null>(null)
  const outline = ref<Point[]>([])
  let start: Point | null = null

  function toImage(event: PointerEvent): Point {
    const box = (frame.value as HTMLElement).getBoundingClientRect()
    const { width, height } = size()
    return {
      x: Math.round(((event.clientX - box.left) / box.width) * width * 10) / 10,
      y: Math.round(((event.clientY - box.top) / box.height) * height * 10) / 10,
    }
  }

  function down(event: PointerEvent): void {
    if (!tool.value) return
    event.preventDefault()
    start = toImage(event)
    line.value = null
  }

  function move(event: PointerEvent): void {
    if (!start || !tool.value || tool.value === 'label' || tool.value === 'outline') return
    line.value = { from: start, to: toImage(event) }
  }

  function up(event: PointerEvent): void {
    if (!start || !tool.value) return
    const from = start
    const to = toImage(event)
    start = null
    const dragged = pixelDistance(from, to) >= CLICK
    const current = tool.value
    if (current === 'outline') outline.value = [...outline.value, to]
    else if (current === 'label') done({ tool: current, at: to })
    else if (!dragged) line.value = null
    else if (current === 'arrow') done({ tool: current, mark: { kind: 'arrow', from, to } })
    else if (current === 'circle') {
      done({
        tool: current,
        mark: { kind: 'circle', centre: from, radius: pixelDistance(from, to) },
      })
    } else done({ tool: current, line: { from, to } })
    if (current === 'arrow' || current === 'circle') line.value = null
  }

  function finishOutline(): void {
    if (outline.value.length >= 2)
      done({ tool: 'outline', mark: { kind: 'outline', points: outline.value } })
    outline.value = []
  }

  function choose(next: DrawingTool | null): void {
    tool.value = tool.value === next ? null : next
    line.value = null
    outline.value = []
  }

  return { tool, line, outline, down, move, up, finishOutline, choose }
}
