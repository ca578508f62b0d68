// Tells every open browser of a board that its review changed (a comment, reply, edit, deletion,
// resolution or verdict), so it fetches the list again. In-process: each node tells its own
// listeners (the event stream route); the message carries no content, only what changed.
import { EventEmitter } from 'node:events'

export interface ReviewEvent {
  kind: 'comments' | 'verdicts'
  boardId: string
  /** The thread or snapshot concerned. */
  id: string
}

const emitter = new EventEmitter()
emitter.setMaxListeners(0)

export function publishReviewEvent(event: ReviewEvent): void {
  emitter.emit(`board:${event.boardId}`, event)
}

/** Calls `listener` for each event of the board until the returned function is called. */
export function onReviewEvent(boardId: string, listener: (event: ReviewEvent) => void): () => void {
  emitter.on(`board:${boardId}`, listener)
  return () => emitter.off(`board:${boardId}`, listener)
}
