// Keyboard shortcuts of the board besides the element palette's (see additions.ts).
export interface BoardShortcut {
  keys: string
  action: string
}

export const BOARD_SHORTCUTS: readonly BoardShortcut[] = [
  { keys: 'Ctrl+Z', action: 'Undo' },
  { keys: 'Ctrl+Shift+Z or Ctrl+Y', action: 'Redo' },
  { keys: 'Delete', action: 'Remove the selected element' },
  { keys: '[ and ]', action: 'Move the selected element towards the load or the source' },
  { keys: 'K', action: 'Lock or unlock the selected element against dragging' },
  { keys: 'Esc', action: 'Cancel a drag, clear the preview and the selection' },
  { keys: '?', action: 'Show or hide this list' },
]
