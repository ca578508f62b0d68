// Every migration, in order. Never edit one that has shipped; add the next number instead.
import type { Migration } from './types'
import { migration as m0001 } from './0001-users-and-workspaces'

export const migrations: Migration[] = [m0001]
export type { Migration }
