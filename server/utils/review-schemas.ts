// Input shapes of the review routes: comment bodies, anchors and verdicts.
import { z } from 'zod'

export const CommentBodySchema = z.string({ error: 'must be text' })
  .refine(s => s.trim().length > 0, 'must not be empty')
  .refine(s => s.length <= 4000, 'must be at most 4000 characters')

const finite = z.number({ error: 'must be a number' }).refine(Number.isFinite, 'must be a finite number')

export const AnchorSchema = z.discriminatedUnion('kind', [
  z.object({
    kind: z.literal('point'),
    gamma: z.object({ re: finite, im: finite }, { error: 'must be { re, im }' })
      .refine(g => Math.hypot(g.re, g.im) <= 1 + 1e-9, 'must lie on the chart (|Γ| ≤ 1)'),
  }),
  z.object({ kind: z.literal('element'), elementId: z.string({ error: 'must be text' }).min(1, 'must name an element').max(100) }),
  z.object({ kind: z.literal('frequency'), hz: finite.refine(x => x > 0 && x <= 1e12, 'must be above 0 and at most 1 THz') }),
], { error: 'must be { kind: "point" | "element" | "frequency", … }' })

export const NewCommentSchema = z.object({ body: CommentBodySchema, anchor: AnchorSchema.optional() })
export const ReplySchema = z.object({ body: CommentBodySchema })

export const VerdictSchema = z.object({
  verdict: z.enum(['approved', 'changes-requested'], { error: 'must be "approved" or "changes-requested"' }),
  note: z.string({ error: 'must be text' }).max(4000, 'must be at most 4000 characters').optional(),
})
