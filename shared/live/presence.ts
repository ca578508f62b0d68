// What one peer shows the others through awareness. The `user` part is stamped by the server from
// the account; a client's own `user` field is ignored. Pointer is in reflection-coefficient
// coordinates (never screen pixels), so every viewer places it on its own chart transform.
import { z } from 'zod'
import type { LiveRole } from './protocol'

export interface PresenceUser {
  id: number
  name: string
  colour: string
  role: LiveRole
}

export interface PresencePointer { re: number, im: number }
export interface PresenceDrag { elementId: string, value: number }

export interface PresenceState {
  user: PresenceUser
  pointer: PresencePointer | null
  dragging: PresenceDrag | null
}

const finite = z.number().refine(Number.isFinite)
const PointerSchema = z.object({ re: finite, im: finite }).refine(p => Math.hypot(p.re, p.im) <= 4)
const DragSchema = z.object({ elementId: z.string().min(1).max(100), value: finite })

/** The client-chosen part of a presence state, reduced to known fields of the right shape. */
export function sanitizePresence(raw: unknown, user: PresenceUser): PresenceState {
  const source = raw && typeof raw === 'object' ? raw as Record<string, unknown> : {}
  const pointer = PointerSchema.safeParse(source.pointer)
  const dragging = DragSchema.safeParse(source.dragging)
  return {
    user,
    pointer: pointer.success ? { re: pointer.data.re, im: pointer.data.im } : null,
    // Reviewers never edit, so they never show a drag draft either.
    dragging: dragging.success && user.role !== 'reviewer' ? { elementId: dragging.data.elementId, value: dragging.data.value } : null,
  }
}

/** Reads a remote awareness state as a PresenceState, or null when it carries no stamped user. */
export function readPresence(raw: unknown): PresenceState | null {
  if (!raw || typeof raw !== 'object') return null
  const user = (raw as { user?: Partial<PresenceUser> }).user
  if (!user || typeof user.id !== 'number' || typeof user.name !== 'string' || typeof user.colour !== 'string') return null
  const role: LiveRole = user.role === 'admin' || user.role === 'designer' ? user.role : 'reviewer'
  return sanitizePresence(raw, { id: user.id, name: user.name, colour: user.colour, role })
}

// Our own presence hues: darker than the element hues, so a colleague's pointer never reads as a trace.
export const PRESENCE_COLOURS = ['#8a3b12', '#1f5f8b', '#6b2d6b', '#2e6b30', '#9a2a44', '#4b4f9e', '#7a5a00', '#1e6f6a'] as const

/** A stable colour per account: the same person has the same colour on every board and screen. */
export function presenceColourFor(userId: number): string {
  const index = ((userId * 2654435761) >>> 0) % PRESENCE_COLOURS.length
  return PRESENCE_COLOURS[index]!
}
