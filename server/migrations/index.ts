// Every migration, in order. Never edit one that has shipped; add the next number instead.
import type { Migration } from './types'
import { migration as m0001 } from './0001-users-and-workspaces'
import { migration as m0002 } from './0002-invitations-and-password-resets'
import { migration as m0003 } from './0003-boards-snapshots-templates'
import { migration as m0004 } from './0004-uploads-outbox-login-failures'
import { migration as m0005 } from './0005-board-updates'
import { migration as m0006 } from './0006-sessions'
import { migration as m0007 } from './0007-comments-and-verdicts'
import { migration as m0010 } from './0010-parts-library'

export const migrations: Migration[] = [m0001, m0002, m0003, m0004, m0005, m0006, m0007, m0010]
export type { Migration }
