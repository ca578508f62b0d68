// Every edit of a board document: each validates its input first (so a refused edit leaves the
// document untouched) and then writes in exactly one transaction with a named origin.
import * as Y from 'yjs'
import {
  BoardElementSchema, BoardSettingsSchema, LoadTerminalSchema, TerminalSchema,
  type BoardContent, type BoardElement, type BoardSettings, type ElementJson, type Terminal, type TerminalSide,
} from './schema'
import { ORIGIN_LOCAL, boardMap, elementToYMap, elementsArray, readBoard, writeBoardContent } from './ydoc'

/** An element to add: the element JSON, with an id if the caller has one. */
export type NewElement = ElementJson & { id?: string, locked?: boolean }
/** Fields to change on an element; `undefined` removes an optional field (q, tolerance, fRef…). */
export type ElementPatch = { [key: string]: unknown }

export class BoardEditError extends Error {
  override name = 'BoardEditError'
}

/** A fresh element id; randomUUID where the platform has it, else 122 random bits. */
export function newElementId(): string {
  const c = globalThis.crypto
  if (typeof c?.randomUUID === 'function') return c.randomUUID()
  const bytes = c.getRandomValues(new Uint8Array(16))
  return Array.from(bytes, b => b.toString(16).padStart(2, '0')).join('')
}

export function validElement(input: unknown): BoardElement {
  const parsed = BoardElementSchema.safeParse(input)
  if (!parsed.success) {
    const issue = parsed.error.issues[0]
    throw new BoardEditError(`Invalid element${issue?.path.length ? ` ${issue.path.join('.')}` : ''}: ${issue?.message}`)
  }
  return parsed.data
}

function indexOfId(doc: Y.Doc, id: string): number {
  return elementsArray(doc).toArray().findIndex(m => m.get('id') === id)
}

function requireIndex(doc: Y.Doc, id: string): number {
  const index = indexOfId(doc, id)
  if (index < 0) throw new BoardEditError(`No element with id ${id}`)
  return index
}

function clampIndex(index: number | undefined, length: number): number {
  if (index === undefined || !Number.isFinite(index)) return length
  return Math.max(0, Math.min(length, Math.trunc(index)))
}

/** Inserts an element at `index` (default: next to the source end). Returns its id. */
export function addElement(doc: Y.Doc, element: NewElement, index?: number, origin: unknown = ORIGIN_LOCAL): string {
  const valid = validElement({ ...element, id: element.id ?? newElementId() })
  if (indexOfId(doc, valid.id) >= 0) throw new BoardEditError(`An element with id ${valid.id} already exists`)
  doc.transact(() => {
    const array = elementsArray(doc)
    array.insert(clampIndex(index, array.length), [elementToYMap(valid)])
  }, origin)
  return valid.id
}

export function removeElement(doc: Y.Doc, id: string, origin: unknown = ORIGIN_LOCAL): void {
  const index = requireIndex(doc, id)
  doc.transact(() => elementsArray(doc).delete(index, 1), origin)
}

/** Moves an element so that it ends up at `toIndex` of the resulting ladder. */
export function moveElement(doc: Y.Doc, id: string, toIndex: number, origin: unknown = ORIGIN_LOCAL): void {
  const from = requireIndex(doc, id)
  const array = elementsArray(doc)
  const to = clampIndex(toIndex, array.length - 1)
  if (to === from) return
  // Y.Array has no move: delete and re-insert a copy (same id) in one transaction.
  const copy = validElement(array.get(from).toJSON())
  doc.transact(() => {
    array.delete(from, 1)
    array.insert(to, [elementToYMap(copy)])
  }, origin)
}

/** Changes fields of one element; the result must still be a valid element of the same kind. */
export function updateElement(doc: Y.Doc, id: string, patch: ElementPatch, origin: unknown = ORIGIN_LOCAL): void {
  patchElementMap(doc, elementsArray(doc).get(requireIndex(doc, id)), id, patch, origin)
}

/** Applies a patch to one element's Y.Map (of any ladder) after checking the merged element. */
export function patchElementMap(doc: Y.Doc, map: Y.Map<unknown>, id: string, patch: ElementPatch, origin: unknown = ORIGIN_LOCAL): void {
  if ('id' in patch && patch.id !== id) throw new BoardEditError('An element id cannot change')
  if ('kind' in patch && patch.kind !== map.get('kind')) throw new BoardEditError('An element kind cannot change')
  const merged: Record<string, unknown> = { ...map.toJSON(), ...patch }
  for (const key of Object.keys(merged)) if (merged[key] === undefined) delete merged[key]
  validElement(merged)
  doc.transact(() => {
    for (const [key, value] of Object.entries(patch)) {
      if (value === undefined) map.delete(key)
      else if (map.get(key) !== value) map.set(key, value)
    }
  }, origin)
}

export function setLocked(doc: Y.Doc, id: string, locked: boolean, origin: unknown = ORIGIN_LOCAL): void {
  const index = requireIndex(doc, id)
  doc.transact(() => {
    const map = elementsArray(doc).get(index)
    if (locked) map.set('locked', true)
    else map.delete('locked')
  }, origin)
}

/** Replaces the whole ladder (a solver result, say) in one step. Elements without ids get one. */
export function replaceLadder(doc: Y.Doc, elements: NewElement[], origin: unknown = ORIGIN_LOCAL): string[] {
  const valid = elements.map(e => validElement({ ...e, id: e.id ?? newElementId() }))
  if (new Set(valid.map(e => e.id)).size !== valid.length) throw new BoardEditError('Element ids must be unique')
  doc.transact(() => {
    const array = elementsArray(doc)
    if (array.length) array.delete(0, array.length)
    array.insert(0, valid.map(elementToYMap))
  }, origin)
  return valid.map(e => e.id)
}

/** Changes settings; the merged settings must be valid as a whole (band start below stop…). */
export function updateSettings(doc: Y.Doc, patch: Partial<BoardSettings>, origin: unknown = ORIGIN_LOCAL): void {
  const current = readBoard(doc).settings
  const parsed = BoardSettingsSchema.safeParse({ ...current, ...patch })
  if (!parsed.success) {
    const issue = parsed.error.issues[0]
    throw new BoardEditError(`Invalid settings ${issue?.path.join('.')}: ${issue?.message}`)
  }
  const map = boardMap(doc)
  doc.transact(() => {
    for (const key of Object.keys(patch) as (keyof BoardSettings)[]) {
      const value = parsed.data[key]
      if (JSON.stringify(map.get(key)) !== JSON.stringify(value)) map.set(key, structuredClone(value))
    }
  }, origin)
}

export function setTerminal(doc: Y.Doc, side: TerminalSide, terminal: Terminal, origin: unknown = ORIGIN_LOCAL): void {
  const parsed = (side === 'load' ? LoadTerminalSchema : TerminalSchema).safeParse(terminal)
  if (!parsed.success) {
    const issue = parsed.error.issues[0]
    throw new BoardEditError(`Invalid ${side}${issue?.path.length ? ` ${issue.path.join('.')}` : ''}: ${issue?.message}`)
  }
  doc.transact(() => boardMap(doc).set(side, structuredClone(parsed.data)), origin)
}

/** Replaces settings and ladder at once (snapshot restore): a forward change, not a rewind. */
export function replaceBoard(doc: Y.Doc, content: BoardContent, origin: unknown = ORIGIN_LOCAL): void {
  const settings = BoardSettingsSchema.safeParse(content.settings)
  if (!settings.success) throw new BoardEditError(`Invalid settings: ${settings.error.issues[0]?.message}`)
  const elements = content.elements.map(validElement)
  const sides = {
    ...(content.inputSide ? { inputSide: content.inputSide.map(validElement) } : {}),
    ...(content.outputSide ? { outputSide: content.outputSide.map(validElement) } : {}),
  }
  doc.transact(() => writeBoardContent(doc, { settings: settings.data, elements, ...sides }), origin)
}
