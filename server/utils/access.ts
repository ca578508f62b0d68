// The one access check for routes: who is signed in (with a session version that still matches
// the database, so sign-out-everywhere takes effect at once) and what they may do in a workspace.
// What the caller may not see answers 404, exactly as if it did not exist.
import type { H3Event } from 'h3'
import { userOfSession, type SessionClaims } from './sessions'
import {
  roleAtLeast, type BoardInstance, type MembershipInstance, type Role, type SnapshotInstance,
  type TemplateInstance, type UserInstance, type WorkspaceInstance,
} from '../models'

export type AccessTarget =
  | { workspace: string }
  | { boardId: string }
  | { snapshotId: string }
  | { templateId: string }

export interface MemberAccess {
  user: UserInstance
  workspace: WorkspaceInstance
  membership: MembershipInstance
  role: Role
  board?: BoardInstance
  snapshot?: SnapshotInstance
  template?: TemplateInstance
}

/** The signed-in user, or null when there is no session or it has ended (revoked, expired, version raised). */
export async function currentUser(event: H3Event): Promise<UserInstance | null> {
  const session = await getUserSession(event)
  if (typeof session.user?.id !== 'number') return null
  const user = await userOfSession(session)
  if (!user) await clearUserSession(event)
  return user
}

export async function requireSignedIn(event: H3Event): Promise<UserInstance> {
  const user = await currentUser(event)
  if (!user) throw createError({ statusCode: 401, message: 'Sign in to continue.' })
  return user
}

// The same words whether the thing is missing or merely not the caller's to see.
function notFound(target: AccessTarget) {
  const what = 'workspace' in target
    ? `workspace ${target.workspace}`
    : 'boardId' in target ? `board ${target.boardId}` : 'snapshotId' in target ? `snapshot ${target.snapshotId}` : `template ${target.templateId}`
  return createError({ statusCode: 404, message: `No ${what}, or you are not a member of its workspace.` })
}

/** Finds the workspace (and the board, snapshot or template) a target names, or null. */
async function resolveTarget(target: AccessTarget) {
  const { Workspace, Board, Snapshot, Template } = await useModels()
  let board: BoardInstance | null = null
  let snapshot: SnapshotInstance | null = null
  let template: TemplateInstance | null = null
  let workspaceId: number | undefined
  if ('workspace' in target) {
    const workspace = await Workspace.findOne({ where: { slug: target.workspace } })
    return workspace ? { workspace } : null
  }
  if ('templateId' in target) {
    template = await Template.findByPk(target.templateId, { attributes: { exclude: ['state'] } })
    workspaceId = template?.workspaceId
  }
  else {
    if ('snapshotId' in target) {
      snapshot = await Snapshot.findByPk(target.snapshotId)
      if (!snapshot) return null
    }
    board = await Board.findByPk(snapshot ? snapshot.boardId : (target as { boardId: string }).boardId)
    workspaceId = board?.workspaceId
  }
  if (workspaceId === undefined) return null
  const workspace = await Workspace.findByPk(workspaceId)
  return workspace ? { workspace, board: board ?? undefined, snapshot: snapshot ?? undefined, template: template ?? undefined } : null
}

/**
 * The caller's membership where the target lives, with at least `minimumRole`: 401 without a live
 * session, 404 when the target does not exist or the caller is not a member, 403 when the role is
 * too low for this action.
 */
export async function requireMember(event: H3Event, target: AccessTarget, minimumRole: Role): Promise<MemberAccess> {
  const user = await requireSignedIn(event)
  const found = await resolveTarget(target)
  if (!found) throw notFound(target)
  const { Membership } = await useModels()
  const membership = await Membership.findOne({ where: { userId: user.id, workspaceId: found.workspace.id } })
  if (!membership) throw notFound(target)
  if (!roleAtLeast(membership.role, minimumRole)) {
    throw createError({ statusCode: 403, message: `This needs the ${minimumRole} role or higher; you are a ${membership.role} here.` })
  }
  return { user, membership, role: membership.role, ...found }
}

/**
 * For the live server (no H3 event during a WebSocket upgrade): the role of a session's user on a
 * board, or null when the session is stale or the user may not see the board.
 */
export async function boardRoleForSession(session: SessionClaims, boardId: string): Promise<Role | null> {
  const { Board, Membership } = await useModels()
  const user = await userOfSession(session)
  if (!user) return null
  const userId = user.id
  const board = await Board.findByPk(boardId, { attributes: ['id', 'workspaceId'] })
  if (!board) return null
  const membership = await Membership.findOne({ where: { userId, workspaceId: board.workspaceId } })
  return membership?.role ?? null
}
