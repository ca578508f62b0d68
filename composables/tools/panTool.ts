// Panning the chart by dragging its background, as a state machine: while the pointer is held the
// offset grows (the caller shows it by moving the already-drawn layers); on release the offset is
// handed over once, so the cached grid is redrawn once per pan rather than per move.
export interface PanToolActions {
  /** The offset (px) since the pan began, for a cheap preview. */
  offset: (dxPx: number, dyPx: number) => void
  /** The pan ended with this total offset (px); (0, 0) is passed for a click without movement. */
  finish: (dxPx: number, dyPx: number) => void
}

export interface PanTool {
  down: (xPx: number, yPx: number) => void
  move: (xPx: number, yPx: number) => void
  up: () => void
  cancel: () => void
  readonly isPanning: () => boolean
}

export function createPanTool(actions: PanToolActions): PanTool {
  let start: { x: number; y: number } | null = null
  let last = { dx: 0, dy: 0 }
  return {
    isPanning: () => start !== null,
    down(x, y) {
      start = { x, y }
      last = { dx: 0, dy: 0 }
    },
    move(x, y) {
      if (!start) return
      last = { dx: x - start.x, dy: y - start.y }
      actions.offset(last.dx, last.dy)
    },
    up() {
      if (!start) return
      start = null
      actions.finish(last.dx, last.dy)
    },
    cancel() {
      if (!start) return
      start = null
      actions.offset(0, 0)
      actions.finish(0, 0)
    },
  }
}
