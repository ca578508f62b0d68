// Input shapes shared by several routes. Messages say what is wrong in words a form can show.
import { z } from 'zod'
import { ROLES, SLUG_PATTERN } from '../models'

export const NameSchema = z.string({ error: 'must be text' }).trim()
  .min(1, 'must not be empty').max(120, 'must be at most 120 characters')
export const EmailSchema = z.string({ error: 'must be text' }).trim().toLowerCase()
  .max(254, 'must be at most 254 characters').pipe(z.email({ error: 'must be an e-mail address' }))
export const PasswordSchema = z.string({ error: 'must be text' })
  .min(8, 'must be at least 8 characters').max(200, 'must be at most 200 characters')
export const RoleSchema = z.enum(ROLES, { error: 'must be admin, designer or reviewer' })
export const SlugSchema = z.string({ error: 'must be text' }).regex(SLUG_PATTERN, 'is not a workspace slug')
export const TokenSchema = z.string().min(16, 'is not a valid link token').max(100, 'is not a valid link token')
export const BoardIdSchema = z.string().min(1).max(100)
export const UuidSchema = z.string().uuid('is not a valid id')

export const SlugParams = z.object({ slug: SlugSchema })
export const IdParams = z.object({ id: BoardIdSchema })
export const UuidParams = z.object({ id: UuidSchema })
