// Where the outside reference data lives in the repo (copied from the team's reference folder;
// see tests/fixtures/README.md for its provenance).
import { fileURLToPath } from 'node:url'
import { resolve } from 'node:path'

export const REFERENCE_ROOT = fileURLToPath(new URL('../fixtures/reference/', import.meta.url))
export const CASES_FILE = resolve(REFERENCE_ROOT, 'cases.json')
export const TOUCHSTONE_DIR = resolve(REFERENCE_ROOT, 'touchstone')
