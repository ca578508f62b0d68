// A part of the workspace parts library: our own identifier, kind, nominal value, tolerance,
// ratings, its loss and parasitics (a model) or its maker's fixture measurement, and whether the
// team stocks it. One zod schema checks it wherever it enters (REST, CSV import, demo seed); the
// element a tile gets from it is built here too, so the board and the server agree.
import { z } from 'zod'
import { RfInputError, validatePartModel, selfResonanceHz, type PartModel } from '../rf'
import { PartModelSchema, type ElementJson } from '../board/schema'

const finite = z.number().refine(Number.isFinite, 'must be a finite number')
const positive = finite.refine(v => v > 0, 'must be greater than zero')

/** Our own part identifiers: letters, digits, dot, dash, underscore; 1–64 characters. */
export const PartIdSchema = z.string().regex(/^[A-Za-z0-9][A-Za-z0-9._-]{0,63}$/, 'must be 1–64 letters, digits, ".", "-" or "_", starting with a letter or digit')

export const PartInputSchema = z.object({
  partId: PartIdSchema,
  kind: z.enum(['L', 'C']),
  /** Nominal value (H or F). */
  value: positive.refine(v => v < 1, 'must be below 1 H or 1 F'),
  /** Fraction (0.05 = ±5 %). */
  tolerance: finite.refine(v => v >= 0 && v < 1, 'must be a fraction from 0 to below 1').optional(),
  vRatingV: positive.optional(),
  iRatingA: positive.optional(),
  /** A constant Q, used where the model has no Q table. */
  q: positive.refine(v => v <= 1e5, 'must be at most 100000').optional(),
  model: PartModelSchema.optional(),
  measured: z.object({ uploadId: z.string().uuid('must be an upload id'), fixture: z.enum(['series', 'shunt']) }).strict().optional(),
  stocked: z.boolean().default(false),
  description: z.string().max(200).optional(),
}).strict().superRefine((part, ctx) => {
  if (!part.model) return
  try {
    validatePartModel(part.model, part.kind, 'model')
  }
  catch (error) {
    if (!(error instanceof RfInputError)) throw error
    ctx.addIssue({ code: 'custom', path: error.argument.split('.'), message: error.message.replace(/^[^:]*: /, '') })
  }
})
export type PartInput = z.input<typeof PartInputSchema>
export type LibraryPart = z.infer<typeof PartInputSchema>

/** The library part as the API answers it. */
export type LibraryPartRow = LibraryPart & { readonly updatedAt: string }

/**
 * The fields an L or C element takes from a library part (placement and id stay the tile's):
 * the nominal value, tolerance, ratings, Q, model or measured file, and the part's identifier.
 */
export function elementFieldsOf(part: LibraryPart): Partial<Extract<ElementJson, { kind: 'L' | 'C' | 'R' }>> {
  return {
    value: part.value,
    partId: part.partId,
    tolerance: part.tolerance,
    vRatingV: part.vRatingV,
    iRatingA: part.iRatingA,
    q: part.q,
    model: part.model as PartModel | undefined,
    measured: part.measured,
  }
}

/** The fields a tile drops when it goes back to "ideal" (its value stays). */
export const LIBRARY_FIELDS = ['partId', 'model', 'measured', 'vRatingV', 'iRatingA'] as const

/** The part's self-resonance (Hz) from its model, or null. */
export function partResonanceHz(part: Pick<LibraryPart, 'kind' | 'value' | 'model'>): number | null {
  return selfResonanceHz(part)
}
