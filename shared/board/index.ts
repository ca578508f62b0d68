// The board document: schema, Y.Doc reading/writing, edits, palette and demo boards.
export * from './schema'
export * from './ydoc'
export * from './ops'
export * from './palette'
export * from './demo-boards'
export * from './amplifier-ops'
