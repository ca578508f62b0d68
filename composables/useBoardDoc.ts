// The client-side owner of the open board's Y.Doc and its Y.UndoManager. The document is the
// truth; the store only ever receives plain snapshots read from it. A live provider attaches to
// `useBoardDoc().doc` (never to the store).
import * as Y from 'yjs'
import * as ops from '#shared/board/ops'
import * as amplifierOps from '#shared/board/amplifier-ops'
import {
  BOARD_MAP, ELEMENTS_ARRAY, ORIGIN_LOCAL, applyBoardState, createBoardDoc, readBoard, sideArray,
} from '#shared/board/ydoc'
import { AMPLIFIER_SIDES } from '#shared/board/schema'
import type { AmplifierSide, BoardContent, BoardSettings, BoardSnapshot, DeviceRef, Terminal, TerminalSide } from '#shared/board/schema'

/** Where the open document reports to (the board store). */
export interface BoardDocSink {
  applySnapshot: (snapshot: BoardSnapshot) => void
  setHistory: (history: { canUndo: boolean, canRedo: boolean }) => void
}

interface OpenSession {
  doc: Y.Doc
  undoManager: Y.UndoManager
  detach: () => void
}

let session: OpenSession | null = null

function attach(doc: Y.Doc, sink: BoardDocSink): OpenSession {
  const map = doc.getMap(BOARD_MAP)
  const array = doc.getArray(ELEMENTS_ARRAY)
  // An amplifier board's two side ladders are observed and undone like the main ladder.
  const sides = AMPLIFIER_SIDES.map(side => sideArray(doc, side))
  // Only the local user's edits are undoable; each committed edit is its own step.
  const undoManager = new Y.UndoManager([map, array, ...sides], {
    trackedOrigins: new Set([ORIGIN_LOCAL]),
    captureTimeout: 0,
  })
  let lastTransaction: Y.Transaction | null = null
  // Both observers fire after one transaction that touches both types: read once.
  const push = (_events: unknown, transaction: Y.Transaction) => {
    if (transaction === lastTransaction) return
    lastTransaction = transaction
    sink.applySnapshot(readBoard(doc))
  }
  const history = () => sink.setHistory({
    canUndo: undoManager.undoStack.length > 0,
    canRedo: undoManager.redoStack.length > 0,
  })
  map.observeDeep(push)
  array.observeDeep(push)
  for (const s of sides) s.observeDeep(push)
  undoManager.on('stack-item-added', history)
  undoManager.on('stack-item-popped', history)
  undoManager.on('stack-cleared', history)
  sink.applySnapshot(readBoard(doc))
  history()
  return {
    doc,
    undoManager,
    detach: () => {
      map.unobserveDeep(push)
      array.unobserveDeep(push)
      for (const s of sides) s.unobserveDeep(push)
      undoManager.destroy()
    },
  }
}

function requireDoc(): Y.Doc {
  if (!session) throw new Error('No board document is open')
  return session.doc
}

function close(): void {
  session?.detach()
  session?.doc.destroy()
  session = null
}

/** Opens a board from its JSON (a fixture or a REST answer) as a fresh document. */
function open(content: BoardContent, sink: BoardDocSink): Y.Doc {
  close()
  session = attach(createBoardDoc(content), sink)
  return session.doc
}

/**
 * Opens a board from a stored Yjs update, or an empty document (update omitted) that a live
 * provider fills by syncing. Use this rather than `open` when the document will be merged with
 * a server copy: two documents built separately from the same JSON would duplicate elements.
 */
function openState(sink: BoardDocSink, update?: Uint8Array): Y.Doc {
  close()
  const doc = new Y.Doc()
  if (update) applyBoardState(doc, update)
  session = attach(doc, sink)
  return session.doc
}

export function useBoardDoc() {
  return {
    open,
    openState,
    close,
    /** The open document, for a provider to attach to; null when none is open. */
    get doc(): Y.Doc | null { return session?.doc ?? null },
    undo: () => { session?.undoManager.undo() },
    redo: () => { session?.undoManager.redo() },
    /** Ends the current undo capture so the next edit starts a new step. */
    stopCapturing: () => { session?.undoManager.stopCapturing() },
    addElement: (element: ops.NewElement, index?: number) => ops.addElement(requireDoc(), element, index),
    removeElement: (id: string) => ops.removeElement(requireDoc(), id),
    moveElement: (id: string, toIndex: number) => ops.moveElement(requireDoc(), id, toIndex),
    updateElement: (id: string, patch: ops.ElementPatch) => ops.updateElement(requireDoc(), id, patch),
    setLocked: (id: string, locked: boolean) => ops.setLocked(requireDoc(), id, locked),
    replaceLadder: (elements: ops.NewElement[]) => ops.replaceLadder(requireDoc(), elements),
    updateSettings: (patch: Partial<BoardSettings>) => ops.updateSettings(requireDoc(), patch),
    setTerminal: (side: TerminalSide, terminal: Terminal) => ops.setTerminal(requireDoc(), side, terminal),
    replaceBoard: (content: BoardContent) => ops.replaceBoard(requireDoc(), content),
    setDevice: (device: DeviceRef | null) => amplifierOps.setDevice(requireDoc(), device),
    replaceSide: (side: AmplifierSide, elements: ops.NewElement[]) => amplifierOps.replaceSide(requireDoc(), side, elements),
    updateSideElement: (side: AmplifierSide, id: string, patch: ops.ElementPatch) => amplifierOps.updateSideElement(requireDoc(), side, id, patch),
  }
}
