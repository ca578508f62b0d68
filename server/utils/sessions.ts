// Server-side sessions. The sealed cookie (nuxt-auth-utils) carries the user's id and name, the
// session version, and a random session id; the sessions table holds that id's SHA-256 with its
// expiry, so the server can end one session (sign-out) or all of a user's (sign-out everywhere,
// password reset), whatever cookie a browser keeps.
// Lifetime: a session ends after SESSION_IDLE_MS without a request, extended by each request (at
// most once a minute, to spare writes), and never lives beyond SESSION_MAX_MS after sign-in (the
// cookie's own maxAge in nuxt.config.ts is the same 30 days).
import { randomBytes } from 'node:crypto'
import type { H3Event } from 'h3'
import { Op, type Transaction } from 'sequelize'
import type { UserInstance } from '../models'
import { hashToken } from '../database/tokens'
import { liveBridge } from '../database/live-bridge'

export const SESSION_IDLE_MS = 7 * 24 * 60 * 60 * 1000
export const SESSION_MAX_MS = 30 * 24 * 60 * 60 * 1000
const EXTEND_AT_MOST_EVERY_MS = 60 * 1000

/** What the sealed cookie holds (see auth.d.ts). */
export interface SessionClaims {
  user?: { id?: number, name?: string }
  sessionVersion?: number
  sid?: string
}

/** Starts a session for the user (after sign-in, sign-up or a password reset). */
export async function startSession(event: H3Event, user: UserInstance): Promise<void> {
  const { Session } = await useModels()
  const sid = randomBytes(32).toString('base64url')
  await Session.create({ id: hashToken(sid), userId: user.id, expiresAt: new Date(Date.now() + SESSION_IDLE_MS) })
  await replaceUserSession(event, { user: { id: user.id, name: user.name }, sessionVersion: user.sessionVersion, sid })
}

/**
 * The user a session's claims name, or null when the session was revoked, has expired, or
 * predates a raise of the user's session version. A live session's lifetime is extended.
 */
export async function userOfSession(claims: SessionClaims): Promise<UserInstance | null> {
  const userId = claims.user?.id
  if (typeof userId !== 'number' || typeof claims.sid !== 'string') return null
  const { User, Session } = await useModels()
  const row = await Session.findByPk(hashToken(claims.sid))
  const now = Date.now()
  if (!row || row.userId !== userId || row.revokedAt || row.expiresAt.getTime() <= now) return null
  const user = await User.findByPk(userId)
  if (!user || user.sessionVersion !== claims.sessionVersion) return null
  if (now - row.updatedAt.getTime() > EXTEND_AT_MOST_EVERY_MS) {
    const expiresAt = new Date(Math.min(now + SESSION_IDLE_MS, row.createdAt.getTime() + SESSION_MAX_MS))
    await Session.update({ expiresAt }, { where: { id: row.id, revokedAt: null } })
  }
  return user
}

/** The hashed id a live connection is tagged with, so sign-out can close exactly its sockets. */
export function sessionKey(claims: SessionClaims): string | undefined {
  return typeof claims.sid === 'string' ? hashToken(claims.sid) : undefined
}

/** Ends one session on the server and closes the live sockets opened with it. */
export async function revokeSession(claims: SessionClaims): Promise<void> {
  const key = sessionKey(claims)
  if (!key) return
  const { Session } = await useModels()
  await Session.update({ revokedAt: new Date() }, { where: { id: key, revokedAt: null } })
  liveBridge()?.closeSession?.(key)
}

/** Ends every session of a user (inside the caller's transaction when given one); sockets are closed by `closeUserSockets`. */
export async function revokeAllSessions(userId: number, transaction?: Transaction): Promise<void> {
  const { Session } = await useModels()
  await Session.update({ revokedAt: new Date() }, { where: { userId, revokedAt: null }, transaction })
  // Expired rows are of no further use; drop them while we are here.
  await Session.destroy({ where: { userId, expiresAt: { [Op.lt]: new Date(Date.now() - SESSION_IDLE_MS) } }, transaction })
}

/** Closes a user's open live sockets at once (after sign-out everywhere or a password reset). */
export function closeUserSockets(userId: number): void {
  liveBridge()?.closeSocketsOf?.(userId)
}
