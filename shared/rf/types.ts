/**
 * Plain data shapes of the RF core. Everything here passes through JSON, Yjs and HTTP unchanged.
 *
 * Conventions (used by every file of shared/rf):
 * - SI units throughout: Hz, Ω, S, H, F; line and stub lengths in electrical degrees at `fRef`.
 * - A trace starts at the load and each element is applied on the source side of the point so
 *   far, in list order (index 0 sits next to the load).
 * - An open is the infinite impedance `{ re: Infinity, im: 0 }` (see complex.ts `OPEN`); a short
 *   is `{ re: 0, im: 0 }`.
 */

/** A complex number as a plain readonly value, e.g. an impedance in ohms or a reflection coefficient. */
export type Complex = { readonly re: number; readonly im: number }

/** Where a two-terminal element sits: in the signal path (adds impedance) or across it (adds admittance). */
export type Placement = 'series' | 'shunt'

/**
 * A lumped inductor, capacitor or resistor. `value` in H, F or Ω.
 * `q` (L and C only): finite quality factor, modelled as a series ESR = |X|/Q at the analysis frequency.
 * `tolerance`: a fraction (0.05 = ±5 %), used by tolerance analysis, ignored by trace and sweep.
 */
export type LumpedElement = {
  readonly kind: 'L' | 'C' | 'R'
  readonly placement: Placement
  readonly value: number
  readonly q?: number
  readonly tolerance?: number
  /** L and C only: a real part's parasitics and loss by frequency (models.ts); absent, the part is ideal. */
  readonly model?: PartModel
  /** L and C only: the part is its maker's fixture measurement (fixture.ts); value and model are then nominal only. */
  readonly measured?: MeasuredPart
}

/** A part measured by its maker in a series-through or shunt-through fixture: a .s2p upload. */
export type MeasuredPart = {
  readonly uploadId: string
  readonly fixture: 'series' | 'shunt'
}

/**
 * A component model of a real L or C part (models.ts):
 * - `q`: [Hz, Q] pairs in rising frequency, interpolated linearly in log f and log Q and held at
 *   the end values outside the table; absent, the element's own `q` applies (or none).
 * - `srf` (inductor, Hz): self-resonance, a capacitance Cp = 1/((2π·srf)²·L) across the inductor
 *   and its loss.
 * - `esl` (capacitor, H): series inductance.
 * - `padC` (F): pad capacitance to ground at each end of a series part, at the live end of a
 *   shunt part.
 */
export type PartModel = {
  readonly q?: readonly (readonly [number, number])[]
  readonly srf?: number
  readonly esl?: number
  readonly padC?: number
}

/**
 * A lossless series transmission line of characteristic impedance `z0` (Ω) and electrical length
 * `deg` at `fRef` (Hz). At frequency f its length is deg·f/fRef. `fRef` defaults to the analysis
 * frequency in a single-frequency trace; a sweep requires it (a line's length is physical).
 */
export type LineElement = {
  readonly kind: 'line'
  readonly z0: number
  readonly deg: number
  readonly fRef?: number
}

/** A lossless open- or short-circuited stub, placed in shunt or in series; lengths as for a line. */
export type StubElement = {
  readonly kind: 'stub'
  readonly end: 'open' | 'short'
  readonly placement: Placement
  readonly z0: number
  readonly deg: number
  readonly fRef?: number
}

/** An ideal n:1 transformer with n on the source side: z' = n²·z. */
export type TransformerElement = {
  readonly kind: 'xfmr'
  readonly ratio: number
}

/**
 * A measured two-port (a .s2p upload) cascaded in the ladder, port 1 towards the source. Its data
 * is not in the element: trace and sweep take it from a `blocks` lookup by `uploadId` (twoport.ts).
 */
export type BlockElement = {
  readonly kind: 'block'
  readonly uploadId: string
  readonly name?: string
}

/** One element of a ladder: the element JSON shared by the board document, the REST API and the tests. */
export type Element = LumpedElement | LineElement | StubElement | TransformerElement | BlockElement

/** The `kind` field of an element. */
export type ElementKind = Element['kind']

/** Every element kind, for validation and menus. */
export const ELEMENT_KINDS: readonly ElementKind[] = ['L', 'C', 'R', 'line', 'stub', 'xfmr', 'block']

/** The names of the E-series of IEC 60063 that the core knows. */
export type ESeriesName = 'E12' | 'E24' | 'E48' | 'E96'
