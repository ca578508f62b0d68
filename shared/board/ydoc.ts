// Reading and writing the board's Y.Doc. Layout: getMap('board') holds the scalar settings (JSON
// values only), getArray('elements') holds one Y.Map per element, ordered from load to source.
// Everything that reads the document goes through readBoard(); everything that writes it goes
// through ops.ts (or createBoardDoc/applyBoardState here).
import * as Y from 'yjs'
import {
  AMPLIFIER_SIDES, BoardElementSchema, DEFAULT_SETTINGS, SETTINGS_FIELDS,
  type AmplifierSide, type BoardContent, type BoardElement, type BoardSettings, type BoardSnapshot, type SettingsKey,
} from './schema'

/** Transaction origins. Strings, not symbols, so two bundles of this module still agree. */
export const ORIGIN_LOCAL = 'gammaboard:local'
export const ORIGIN_REMOTE = 'gammaboard:remote'
export const ORIGIN_LOAD = 'gammaboard:load'
export const ORIGIN_RESTORE = 'gammaboard:restore'

export const BOARD_MAP = 'board'
export const ELEMENTS_ARRAY = 'elements'

export function boardMap(doc: Y.Doc): Y.Map<unknown> {
  return doc.getMap<unknown>(BOARD_MAP)
}

export function elementsArray(doc: Y.Doc): Y.Array<Y.Map<unknown>> {
  return doc.getArray<Y.Map<unknown>>(ELEMENTS_ARRAY)
}

/** An amplifier board's input or output network: a Y.Array like `elements`, named after the side. */
export function sideArray(doc: Y.Doc, side: AmplifierSide): Y.Array<Y.Map<unknown>> {
  return doc.getArray<Y.Map<unknown>>(side)
}

function issueText(error: { issues: { path: PropertyKey[]; message: string }[] }): string {
  return error.issues
    .slice(0, 2)
    .map(i => (i.path.length ? `${i.path.map(String).join('.')}: ` : '') + i.message)
    .join('; ')
}

function plainOf(entry: unknown): Record<string, unknown> | null {
  if (entry instanceof Y.Map) return entry.toJSON() as Record<string, unknown>
  if (entry && typeof entry === 'object' && !Array.isArray(entry)) return entry as Record<string, unknown>
  return null
}

function readSettings(map: Y.Map<unknown>, problems: string[]): BoardSettings {
  const settings: Record<string, unknown> = {}
  for (const key of Object.keys(SETTINGS_FIELDS) as SettingsKey[]) {
    const raw = map.get(key)
    const fallback = DEFAULT_SETTINGS[key]
    if (raw === undefined) {
      if (fallback === undefined) continue // an optional key: absent is fine
      problems.push(`settings.${key} is missing; using ${JSON.stringify(fallback)}`)
      settings[key] = structuredClone(fallback)
      continue
    }
    const parsed = SETTINGS_FIELDS[key].safeParse(raw instanceof Y.AbstractType ? raw.toJSON() : raw)
    if (parsed.success) settings[key] = parsed.data
    else {
      problems.push(`settings.${key} is invalid (${issueText(parsed.error)}); ${fallback === undefined ? 'ignored' : `using ${JSON.stringify(fallback)}`}`)
      if (fallback !== undefined) settings[key] = structuredClone(fallback)
    }
  }
  const result = settings as BoardSettings
  if (!(result.bandStartHz < result.bandStopHz)) {
    problems.push('settings band start is not below band stop; using the default band')
    result.bandStartHz = DEFAULT_SETTINGS.bandStartHz
    result.bandStopHz = DEFAULT_SETTINGS.bandStopHz
  }
  return result
}

function readElements(array: Y.Array<unknown>, problems: string[], label = 'elements'): BoardElement[] {
  const elements: BoardElement[] = []
  const seen = new Set<string>()
  array.toArray().forEach((entry, index) => {
    const plain = plainOf(entry)
    if (!plain) {
      problems.push(`${label}[${index}] is not an element map; skipped`)
      return
    }
    const parsed = BoardElementSchema.safeParse(plain)
    if (!parsed.success) {
      problems.push(`${label}[${index}] is invalid (${issueText(parsed.error)}); skipped`)
      return
    }
    // Two concurrent moves of one element can leave two copies: keep the first.
    if (seen.has(parsed.data.id)) {
      problems.push(`${label}[${index}] repeats id ${parsed.data.id}; skipped`)
      return
    }
    seen.add(parsed.data.id)
    elements.push(parsed.data)
  })
  return elements
}

/** The one validated reader: a plain snapshot of the document. Never throws on bad content. */
export function readBoard(doc: Y.Doc): BoardSnapshot {
  const problems: string[] = []
  const settings = readSettings(boardMap(doc), problems)
  const elements = readElements(elementsArray(doc) as Y.Array<unknown>, problems)
  const snapshot: BoardSnapshot = { settings, elements, problems }
  // The sides appear only on amplifier boards, so every other board reads as it always has.
  if (settings.device || AMPLIFIER_SIDES.some(side => sideArray(doc, side).length > 0)) {
    for (const side of AMPLIFIER_SIDES) snapshot[side] = readElements(sideArray(doc, side) as Y.Array<unknown>, problems, side)
  }
  return snapshot
}

/** A Y.Map holding one element's JSON; undefined fields are left out (Yjs cannot store them). */
export function elementToYMap(element: BoardElement): Y.Map<unknown> {
  const map = new Y.Map<unknown>()
  for (const [key, value] of Object.entries(element)) {
    if (value !== undefined) map.set(key, value)
  }
  return map
}

/** Writes settings and elements into an existing doc; call inside a transaction. */
export function writeBoardContent(doc: Y.Doc, content: BoardContent): void {
  const map = boardMap(doc)
  for (const [key, value] of Object.entries(content.settings)) map.set(key, structuredClone(value))
  const array = elementsArray(doc)
  if (array.length) array.delete(0, array.length)
  array.insert(0, content.elements.map(elementToYMap))
  // A passive board's content (an older snapshot, say) clears any sides and the device.
  if (!content.settings.device) map.delete('device')
  for (const side of AMPLIFIER_SIDES) {
    const sideElements = content[side] ?? []
    const target = sideArray(doc, side)
    if (target.length) target.delete(0, target.length)
    if (sideElements.length) target.insert(0, sideElements.map(elementToYMap))
  }
}

/** A new document holding the given board, written in one ORIGIN_LOAD transaction. */
export function createBoardDoc(content: BoardContent): Y.Doc {
  const doc = new Y.Doc()
  doc.transact(() => writeBoardContent(doc, content), ORIGIN_LOAD)
  return doc
}

/** The whole document as one Yjs update (what the database stores). */
export function encodeBoardState(doc: Y.Doc): Uint8Array {
  return Y.encodeStateAsUpdate(doc)
}

/** Applies a stored or received update; loading is never undoable, hence ORIGIN_LOAD by default. */
export function applyBoardState(doc: Y.Doc, update: Uint8Array, origin: unknown = ORIGIN_LOAD): void {
  Y.applyUpdate(doc, update, origin)
}

/** Reads a stored update into a plain snapshot without keeping a document around. */
export function boardFromState(update: Uint8Array): BoardSnapshot {
  const doc = new Y.Doc()
  try {
    applyBoardState(doc, update)
    return readBoard(doc)
  }
  finally {
    doc.destroy()
  }
}
