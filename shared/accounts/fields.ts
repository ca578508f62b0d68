// Form fields shared by the pages (to show what is wrong before sending) and the server routes
// (which decide). Messages are written to be shown beside the field.
import { z } from 'zod'

export const NAME_MAX = 120

// C0 controls (NUL included) and DEL, and a UTF-16 half without its other half: a lone
// surrogate is not text, and neither survives every database, mail header and JSON reader.
const CONTROL = /[\u0000-\u001f\u007f]/
const LONE_SURROGATE = /[\ud800-\udbff](?![\udc00-\udfff])|(?<![\ud800-\udbff])[\udc00-\udfff]/

/** True for a single line of well-formed text: no control characters, no lone surrogates. */
export function isPlainText(value: string): boolean {
  return !CONTROL.test(value) && !LONE_SURROGATE.test(value)
}

export const NameSchema = z.string({ error: 'must be text' }).trim()
  .min(1, 'must not be empty').max(NAME_MAX, `must be at most ${NAME_MAX} characters`)
  .refine(isPlainText, 'must not contain control characters or broken Unicode')
export const EmailSchema = z.string({ error: 'must be text' }).trim().toLowerCase()
  .max(254, 'must be at most 254 characters').pipe(z.email({ error: 'must be an e-mail address' }))
export const PasswordSchema = z.string({ error: 'must be text' })
  .min(8, 'must be at least 8 characters').max(200, 'must be at most 200 characters')

export const ROLES = ['reviewer', 'designer', 'admin'] as const
export type Role = typeof ROLES[number]
export const RoleSchema = z.enum(ROLES, { error: 'must be admin, designer or reviewer' })

/** Field name → first problem, for showing beside each input; empty when all is well. */
export function fieldErrors(schema: z.ZodType, values: unknown): Record<string, string> {
  const parsed = schema.safeParse(values)
  if (parsed.success) return {}
  const errors: Record<string, string> = {}
  for (const issue of parsed.error.issues) {
    const key = String(issue.path[0] ?? 'form')
    errors[key] ??= issue.message
  }
  return errors
}
