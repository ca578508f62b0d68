// Request bodies of the RF computation routes: the arguments of the shared/rf functions as JSON.
// Element JSON and {re, im} come from the board schema, so the API accepts what a board holds,
// less measured blocks (their data lives in uploads, which these public routes do not read).
// Sizes are capped so one request cannot tie up the server.
import { z } from 'zod'
import {
  ComplexSchema, LineElementSchema, LumpedElementSchema, StubElementSchema, TransformerElementSchema,
} from '../../shared/board/schema'

/** Most elements in one ladder. */
export const RF_MAX_ELEMENTS = 200
/** Most frequencies in one sweep (a 100,000-step band plus its end point). */
export const RF_MAX_FREQUENCIES = 100_001
/** Largest JSON body, by its Content-Length: a full sweep with one load per frequency fits in a few MB. */
export const RF_MAX_BODY_BYTES = 16 * 1024 * 1024

const positiveNumber = z.number({ error: 'must be a number' }).positive('must be greater than zero')

/**
 * An impedance: `{ re, im }` with finite parts, or an open written as `{ re: "Infinity", im: 0 }`
 * (JSON has no infinity; the same spelling the responses use).
 */
const ImpedanceBodySchema = z.union([
  ComplexSchema,
  z.object({ re: z.literal('Infinity'), im: z.number() }).transform(() => ({ re: Infinity, im: 0 })),
], { error: 'must be { re, im } with finite numbers, or { re: "Infinity", im: 0 } for an open' })

/** A complex argument that may also be given as a real number. */
const ComplexOrRealSchema = z.union([ComplexSchema, z.number()], { error: 'must be { re, im } or a number' })

/** The element JSON the RF core computes with: L, C, R, line, stub, xfmr. */
const RfElementSchema = z.discriminatedUnion('kind', [LumpedElementSchema, LineElementSchema, StubElementSchema, TransformerElementSchema])
const ElementsBodySchema = z.array(RfElementSchema).max(RF_MAX_ELEMENTS, `at most ${RF_MAX_ELEMENTS} elements`)

export const TraceBodySchema = z.object({
  z0: positiveNumber,
  frequency: positiveNumber,
  load: ImpedanceBodySchema,
  elements: ElementsBodySchema,
})

export const SweepBodySchema = z.object({
  z0: positiveNumber,
  frequencies: z.array(positiveNumber).min(1, 'needs at least one frequency').max(RF_MAX_FREQUENCIES, `at most ${RF_MAX_FREQUENCIES} frequencies`),
  load: z.union([ImpedanceBodySchema, z.array(ImpedanceBodySchema).max(RF_MAX_FREQUENCIES)], { error: 'must be one impedance { re, im } or one per frequency' }),
  elements: ElementsBodySchema,
})

export const SolveLBodySchema = z.object({
  z0: positiveNumber.optional(),
  frequency: positiveNumber,
  from: ComplexOrRealSchema,
  to: ComplexOrRealSchema,
})

export const SolveStubBodySchema = z.object({
  z0: positiveNumber,
  frequency: positiveNumber,
  load: ImpedanceBodySchema,
  end: z.enum(['open', 'short']),
  placement: z.enum(['shunt', 'series']).optional(),
  stubZ0: positiveNumber.optional(),
})

/** Most frequencies in one match search, and its largest ladder (the search's cost grows with both). */
export const RF_SEARCH_MAX_FREQUENCIES = 401
export const RF_SEARCH_MAX_ELEMENTS = 3

const PassiveImpedanceSchema = ComplexSchema.refine(z => z.re >= 0, 'must be passive (re ≥ 0)')

export const SearchBodySchema = z.object({
  z0: positiveNumber,
  frequencies: z.array(positiveNumber).min(1, 'needs at least one frequency')
    .max(RF_SEARCH_MAX_FREQUENCIES, `at most ${RF_SEARCH_MAX_FREQUENCIES} frequencies`),
  load: z.union([PassiveImpedanceSchema, z.array(PassiveImpedanceSchema).max(RF_SEARCH_MAX_FREQUENCIES)],
    { error: 'must be one passive impedance { re, im } or one per frequency' }),
  series: z.enum(['E12', 'E24', 'E48', 'E96']),
  maxElements: z.number().int('must be a whole number').min(1, 'at least 1').max(RF_SEARCH_MAX_ELEMENTS, `at most ${RF_SEARCH_MAX_ELEMENTS}`),
  q: z.object({ L: positiveNumber.optional(), C: positiveNumber.optional() }).strict().optional(),
  limit: z.number().int('must be a whole number').min(1).max(100).optional(),
}).refine(b => !Array.isArray(b.load) || b.load.length === b.frequencies.length,
  { path: ['load'], message: 'needs one impedance per frequency' })
