// Routes the chart's raw pointer events to its tools: a press on a handle starts a drag, a press
// on the background starts a pan, a move without a press is hover. Drag moves are coalesced to
// one per frame. No canvas here: positions arrive as stage pixels and the caller converts.
import type { Complex } from '#shared/rf'
import type { DragTool } from './dragTool'
import type { PanTool } from './panTool'
import { createFrameCoalescer, type FrameScheduler } from './frameCoalescer'

export interface ChartPointerOptions {
  drag: DragTool
  pan: PanTool
  /** The handle under a stage point, or null. */
  handleAt: (xPx: number, yPx: number) => string | null
  toGamma: (xPx: number, yPx: number) => Complex
  /** The pointer is over the chart at Γ (null: it left). */
  hover: (gamma: Complex | null, xPx: number, yPx: number) => void
  /**
   * A coalesced drag move was applied: `eventAt` is when the newest pointer event it served was
   * handled, `frameAt` when the frame callback began computing it (same clock as `now`).
   */
  dragged?: (eventAt: number, frameAt: number) => void
  /** A press and release on the background without moving (a click), at the press point. */
  click?: (xPx: number, yPx: number) => void
  schedule: FrameScheduler
  now?: () => number
}

export type PointerMode = 'idle' | 'dragging' | 'panning'

export interface ChartPointer {
  down: (xPx: number, yPx: number, button?: number) => PointerMode
  move: (xPx: number, yPx: number) => void
  up: () => void
  cancel: () => void
  leave: () => void
  readonly mode: () => PointerMode
}

export function createChartPointer(options: ChartPointerOptions): ChartPointer {
  const { drag, pan } = options
  const now = options.now ?? (() => performance.now())
  const moves = createFrameCoalescer<{ x: number; y: number; at: number }>((p) => {
    const frameAt = now()
    drag.move(options.toGamma(p.x, p.y))
    options.dragged?.(p.at, frameAt)
  }, options.schedule)

  // Movement below this is a click, not a pan.
  const CLICK_SLOP_PX = 3
  let pressedAt: { x: number; y: number } | null = null
  let travelled = 0

  const mode = (): PointerMode => drag.isDragging() ? 'dragging' : pan.isPanning() ? 'panning' : 'idle'

  return {
    mode,
    down(x, y, button = 0) {
      if (button !== 0 || mode() !== 'idle') return mode()
      const id = options.handleAt(x, y)
      if (id !== null && drag.down(id)) return 'dragging'
      pressedAt = { x, y }
      travelled = 0
      pan.down(x, y)
      return 'panning'
    },
    move(x, y) {
      const at = now()
      options.hover(options.toGamma(x, y), x, y)
      if (drag.isDragging()) moves.push({ x, y, at })
      else if (pan.isPanning()) {
        if (pressedAt) travelled = Math.max(travelled, Math.hypot(x - pressedAt.x, y - pressedAt.y))
        pan.move(x, y)
      }
    },
    up() {
      if (drag.isDragging()) {
        moves.flush()
        drag.up()
        return
      }
      const press = pressedAt
      const isClick = pan.isPanning() && press !== null && travelled < CLICK_SLOP_PX
      pressedAt = null
      if (isClick) {
        pan.cancel()
        options.click?.(press.x, press.y)
      }
      else pan.up()
    },
    cancel() {
      pressedAt = null
      moves.drop()
      drag.cancel()
      pan.cancel()
    },
    leave() {
      options.hover(null, 0, 0)
    },
  }
}
