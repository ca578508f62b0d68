// Who may open a live connection, decided in the upgrade before the socket exists: the Origin
// (our own, or none from a non-browser client), a live session, and membership of the board's
// workspace. Every refusal is a Response, because anything else thrown in an upgrade leaves the
// socket hanging instead of refusing it.
import { boardRoleForSession } from '../access'
import { sessionKey } from '../sessions'
import { useModels } from '../db'
import { presenceColourFor } from '../../../shared/live/presence'
import type { LiveIdentity } from './types'

const refuse = (status: number, message: string) => new Response(message, { status, headers: { 'content-type': 'text/plain' } })

/** Same rule as the HTTP middleware: no Origin is accepted, a foreign one is not. */
export function isOwnOrigin(request: Request): boolean {
  const origin = request.headers.get('origin')
  if (!origin) return true
  return origin === new URL(request.url).origin
}

export function boardIdOf(request: Request): string {
  const last = new URL(request.url).pathname.split('/').filter(Boolean).pop() ?? ''
  try {
    return decodeURIComponent(last)
  }
  catch {
    return ''
  }
}

export async function admitPeer(request: Request): Promise<{ boardId: string, identity: LiveIdentity }> {
  if (!isOwnOrigin(request)) throw refuse(403, 'Cross-origin connection refused.')
  const boardId = boardIdOf(request)
  if (!boardId || boardId.length > 100) throw refuse(404, 'No such board.')
  let session: Awaited<ReturnType<typeof getUserSession>>
  try {
    // Without a valid cookie this throws a plain Error (it cannot start a session here).
    session = await getUserSession(request as never)
  }
  catch {
    throw refuse(401, 'Sign in to continue.')
  }
  if (!session.user) throw refuse(401, 'Sign in to continue.')
  const role = await boardRoleForSession(session, boardId)
  // Stale session, unknown board and non-member look the same from outside.
  if (!role) throw refuse(403, 'Not a member of this board\'s workspace, or the session has ended.')
  const { Board } = await useModels()
  const board = await Board.findByPk(boardId, { attributes: ['id', 'workspaceId'] })
  if (!board) throw refuse(403, 'Not a member of this board\'s workspace, or the session has ended.')
  const userId = session.user.id
  return {
    boardId,
    identity: {
      userId, name: session.user.name, colour: presenceColourFor(userId), role, workspaceId: board.workspaceId, sessionKey: sessionKey(session),
    },
  }
}
