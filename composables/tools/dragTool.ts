// Dragging an element's handle as a small state machine, free of any canvas: the caller feeds it
// pointer events (already turned into Γ) and it calls the board through the functions it was
// given. Idle → (down on a handle) → dragging → (up: commit | Escape: cancel) → idle.
import type { Complex, DragResult } from '#shared/rf'

export interface DragToolActions {
  /** Starts a drag of the element; false when the board refuses (locked, read-only, gone). */
  begin: (elementId: string) => boolean
  /** The constrained result for the pointer (shared/rf drag math), or null if the element is gone. */
  solve: (elementId: string, pointer: Complex) => DragResult | null
  /** Shows the value as a draft (the document is untouched). */
  preview: (value: number) => void
  commit: () => void
  cancel: () => void
}

export type DragToolState =
  | { readonly mode: 'idle' }
  | { readonly mode: 'dragging'; readonly elementId: string; readonly last: DragResult | null }

export interface DragTool {
  readonly state: () => DragToolState
  /** Pointer pressed on a handle. Returns true if a drag started. */
  down: (elementId: string) => boolean
  /** Pointer moved to `pointer` (Γ). Returns the result shown, or null when not dragging. */
  move: (pointer: Complex) => DragResult | null
  /** Pointer released: commits the drag (one undo step). */
  up: () => void
  /** Escape or a lost pointer: drops the draft. */
  cancel: () => void
  readonly isDragging: () => boolean
}

export function createDragTool(actions: DragToolActions): DragTool {
  let state: DragToolState = { mode: 'idle' }
  return {
    state: () => state,
    isDragging: () => state.mode === 'dragging',
    down(elementId) {
      if (state.mode === 'dragging') return false
      if (!actions.begin(elementId)) return false
      state = { mode: 'dragging', elementId, last: null }
      return true
    },
    move(pointer) {
      if (state.mode !== 'dragging') return null
      const result = actions.solve(state.elementId, pointer)
      if (!result) {
        actions.cancel()
        state = { mode: 'idle' }
        return null
      }
      actions.preview(result.value)
      state = { ...state, last: result }
      return result
    },
    up() {
      if (state.mode !== 'dragging') return
      state = { mode: 'idle' }
      actions.commit()
    },
    cancel() {
      if (state.mode !== 'dragging') return
      state = { mode: 'idle' }
      actions.cancel()
    },
  }
}
