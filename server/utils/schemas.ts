// Input shapes shared by several routes. Messages say what is wrong in words a form can show; the
// account fields are the same ones the pages check before sending (#shared/accounts/fields).
import { z } from 'zod'
import { SLUG_PATTERN } from '../models/workspace'

import * as fields from '../../shared/accounts/fields'

export const NameSchema = fields.NameSchema
export const EmailSchema = fields.EmailSchema
export const PasswordSchema = fields.PasswordSchema
export const RoleSchema = fields.RoleSchema

export const SlugSchema = z.string({ error: 'must be text' }).regex(SLUG_PATTERN, 'is not a workspace slug')
export const TokenSchema = z.string().min(16, 'is not a valid link token').max(100, 'is not a valid link token')
export const BoardIdSchema = z.string().min(1).max(100)
export const UuidSchema = z.string().uuid('is not a valid id')
/** A user id in a path: plain decimal digits only (Number() would also take "0x3", " 3" and "3e0"). */
export const UserIdSchema = z.string().regex(/^[1-9][0-9]{0,14}$/, 'is not a user id').transform(Number)

export const SlugParams = z.object({ slug: SlugSchema })
export const IdParams = z.object({ id: BoardIdSchema })
export const UuidParams = z.object({ id: UuidSchema })
