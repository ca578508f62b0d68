// The board document's shapes: zod schemas for the settings map and the element maps of the
// Y.Doc, and the plain snapshot the rest of the app reads. JSON primitives only; nothing derived.
import { z } from 'zod'

export const SCHEMA_VERSION = 1

const finite = z.number().refine(Number.isFinite, 'must be a finite number')
const positive = finite.refine(v => v > 0, 'must be greater than zero')
const nonNegative = finite.refine(v => v >= 0, 'must not be negative')
const frequencyHz = positive.refine(v => v <= 1e12, 'must be at most 1 THz')

export const ComplexSchema = z.object({ re: finite, im: finite })

// ---- elements ----------------------------------------------------------------------------

/**
 * A real part's model (shared/rf types.ts `PartModel`): Q by frequency ([Hz, Q] rows, rising),
 * an inductor's self-resonance, a capacitor's series inductance, pad capacitance to ground.
 * The RF core checks which fields fit which kind (validatePartModel).
 */
export const PartModelSchema = z.object({
  q: z.array(z.tuple([frequencyHz, positive])).min(1).max(64)
    .refine(rows => rows.every((r, i) => i === 0 || r[0] > rows[i - 1]![0]), 'frequencies must rise through the table')
    .optional(),
  srf: frequencyHz.optional(),
  esl: nonNegative.refine(v => v < 1e-6, 'must be below 1 µH').optional(),
  padC: nonNegative.refine(v => v < 1e-9, 'must be below 1 nF').optional(),
}).strict()
export type PartModelJson = z.infer<typeof PartModelSchema>

const lumpedFields = {
  placement: z.enum(['series', 'shunt']),
  value: positive,
  q: positive.optional(),
  tolerance: nonNegative.refine(v => v < 1, 'must be a fraction below 1').optional(),
  /** An absolute tolerance in SI units (e.g. 0.1e-12 for ±0.1 pF); the wider of the two applies. */
  toleranceAbs: positive.optional(),
  /** Ratings (RMS): the voltage across and current through the part it is made for. */
  vRatingV: positive.optional(),
  iRatingA: positive.optional(),
  /** L and C: the real part's parasitics and loss by frequency; absent, the part is ideal. */
  model: PartModelSchema.optional(),
  /** L and C: the part is its maker's fixture measurement (a .s2p upload), used instead of value and model. */
  measured: z.object({ uploadId: z.string().min(1).max(100), fixture: z.enum(['series', 'shunt']) }).strict().optional(),
  /** The workspace parts-library identifier of the part this element is (its model copied in). */
  partId: z.string().min(1).max(64).optional(),
}
export const LumpedElementSchema = z.object({ kind: z.enum(['L', 'C', 'R']), ...lumpedFields })
export const LineElementSchema = z.object({
  kind: z.literal('line'),
  z0: positive,
  deg: nonNegative,
  fRef: frequencyHz.optional(),
})
export const StubElementSchema = z.object({
  kind: z.literal('stub'),
  end: z.enum(['open', 'short']),
  placement: z.enum(['shunt', 'series']),
  z0: positive,
  deg: nonNegative,
  fRef: frequencyHz.optional(),
})
export const TransformerElementSchema = z.object({ kind: z.literal('xfmr'), ratio: positive })
const uploadId = z.string().min(1).max(100)
/** A measured two-port (a .s2p upload) in the ladder; its data is fetched by uploadId, never stored here. */
export const BlockElementSchema = z.object({ kind: z.literal('block'), uploadId, name: z.string().max(255) })

/** The element JSON shared by the Y.Doc, the REST API and the RF core (no id). */
export const ElementSchema = z.discriminatedUnion('kind', [
  LumpedElementSchema,
  LineElementSchema,
  StubElementSchema,
  TransformerElementSchema,
  BlockElementSchema,
])
export type ElementJson = z.infer<typeof ElementSchema>

const elementIdentity = { id: z.string().min(1).max(100), locked: z.boolean().optional() }
export const BoardElementSchema = z.discriminatedUnion('kind', [
  LumpedElementSchema.extend(elementIdentity),
  LineElementSchema.extend(elementIdentity),
  StubElementSchema.extend(elementIdentity),
  TransformerElementSchema.extend(elementIdentity),
  BlockElementSchema.extend(elementIdentity),
])
/** An element of the ladder as stored: the element JSON plus its id and lock flag. */
export type BoardElement = z.infer<typeof BoardElementSchema>
export type ElementKind = BoardElement['kind']

// ---- terminals ---------------------------------------------------------------------------

export const ImpedanceTerminalSchema = z.object({
  kind: z.literal('impedance'),
  z: z.object({ re: nonNegative, im: finite }),
})
export const RlcTerminalSchema = z.object({
  kind: z.literal('rlc'),
  topology: z.enum(['series', 'parallel']),
  r: nonNegative.optional(),
  l: positive.optional(),
  c: positive.optional(),
}).refine(t => t.r !== undefined || t.l !== undefined || t.c !== undefined, 'needs at least one of r, l, c')
export const Z0TerminalSchema = z.object({ kind: z.literal('z0') })
/** A measured one-port (a .s1p upload): the impedance across frequency comes from its S11. */
export const MeasuredTerminalSchema = z.object({ kind: z.literal('measured'), uploadId })

/** A load: a fixed impedance, an R-L-C model or a measured file. */
export const LoadTerminalSchema = z.union([ImpedanceTerminalSchema, RlcTerminalSchema, MeasuredTerminalSchema])
/** Any terminal; a source may also be `{ kind: 'z0' }`, a matched source of the board's Z0. */
export const TerminalSchema = z.union([ImpedanceTerminalSchema, RlcTerminalSchema, Z0TerminalSchema, MeasuredTerminalSchema])
export type Terminal = z.infer<typeof TerminalSchema>
export type LoadTerminal = z.infer<typeof LoadTerminalSchema>
export type TerminalSide = 'load' | 'source'

// ---- settings ----------------------------------------------------------------------------

export const SNAP_SERIES = ['none', 'E12', 'E24', 'E48', 'E96'] as const
export type SnapSeries = typeof SNAP_SERIES[number]

export const BandSpecSchema = z.object({
  minReturnLossDb: finite.refine(v => v >= 0 && v <= 80, 'must be between 0 and 80 dB'),
  f1Hz: frequencyHz,
  f2Hz: frequencyHz,
}).refine(s => s.f1Hz < s.f2Hz, 'f1Hz must be below f2Hz')

export const DefaultQSchema = z.object({
  L: positive.refine(v => v <= 1e5, 'must be at most 100000').optional(),
  C: positive.refine(v => v <= 1e5, 'must be at most 100000').optional(),
})
/** Typical Q of small RF chip parts, offered when a board has no defaults yet (common practice). */
export const TYPICAL_PART_Q = { L: 40, C: 200 } as const

/** One field schema per key of getMap('board'): the reader checks each key on its own. */
export const SETTINGS_FIELDS = {
  schemaVersion: z.literal(SCHEMA_VERSION),
  z0: positive,
  frequencyHz,
  bandStartHz: frequencyHz,
  bandStopHz: frequencyHz,
  bandPoints: z.number().int('must be a whole number').min(2).max(2001),
  load: LoadTerminalSchema,
  source: TerminalSchema,
  spec: BandSpecSchema,
  snapSeries: z.enum(SNAP_SERIES),
  // Optional keys, added later: an older document simply lacks them (the reader reports nothing).
  /** Q given to L and C parts that have none of their own; absent, such parts are lossless. */
  defaultQ: DefaultQSchema.optional(),
  /** An amplifier board's device: its .s2p upload (with a noise block when the file has one). */
  device: z.object({ uploadId, fileName: z.string().min(1).max(255) }).strict().optional(),
  /** Available power of the source (W) for the stress figures. */
  sourcePowerW: positive.refine(v => v <= 1e6, 'must be at most 1 MW').optional(),
}
export type SettingsKey = keyof typeof SETTINGS_FIELDS

export const BoardSettingsSchema = z.object(SETTINGS_FIELDS)
  .refine(s => s.bandStartHz < s.bandStopHz, { message: 'bandStartHz must be below bandStopHz', path: ['bandStopHz'] })
export type BoardSettings = z.infer<typeof BoardSettingsSchema>

/** Settings used where the document has none (a fresh board, or a missing or bad key). */
export const DEFAULT_SETTINGS: BoardSettings = {
  schemaVersion: SCHEMA_VERSION,
  z0: 50,
  frequencyHz: 1e9,
  bandStartHz: 0.9e9,
  bandStopHz: 1.1e9,
  bandPoints: 101,
  load: { kind: 'impedance', z: { re: 50, im: 0 } },
  source: { kind: 'z0' },
  spec: { minReturnLossDb: 10, f1Hz: 0.95e9, f2Hz: 1.05e9 },
  snapSeries: 'none',
}

// ---- snapshot ----------------------------------------------------------------------------

export const BoardSnapshotSchema = z.object({
  settings: BoardSettingsSchema,
  elements: z.array(BoardElementSchema),
  /**
   * An amplifier board's two networks, each traced from its terminal (Z0) towards the device: the
   * input side from the source, the output side from the load. Absent on passive boards (and on
   * every board made before amplifier boards), which therefore read exactly as they always did.
   */
  inputSide: z.array(BoardElementSchema).optional(),
  outputSide: z.array(BoardElementSchema).optional(),
  problems: z.array(z.string()),
})
/** The validated plain view of a board document; `problems` lists what the reader skipped. */
export type BoardSnapshot = z.infer<typeof BoardSnapshotSchema>
/** What a board is built from: a snapshot without the reader's problem list. */
export type BoardContent = Pick<BoardSnapshot, 'settings' | 'elements' | 'inputSide' | 'outputSide'>
/** The two networks of an amplifier board. */
export type AmplifierSide = 'inputSide' | 'outputSide'
export const AMPLIFIER_SIDES: readonly AmplifierSide[] = ['inputSide', 'outputSide']
/** The device reference kept in settings.device. */
export type DeviceRef = NonNullable<BoardSettings['device']>
