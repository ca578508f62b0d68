// Awareness on the server: every state a peer publishes is rewritten with the identity from its
// account (name, colour, role) and reduced to the fields we know, and a peer may only speak for
// awareness client ids that no other connection in the room already owns.
import * as encoding from 'lib0/encoding'
import * as decoding from 'lib0/decoding'
import * as awarenessProtocol from 'y-protocols/awareness'
import { sanitizePresence, type PresenceUser } from '../../../shared/live/presence'
import type { LiveIdentity } from './types'

export interface AwarenessEntry {
  clientId: number
  clock: number
  state: unknown
}

export function decodeAwarenessUpdate(update: Uint8Array): AwarenessEntry[] {
  const decoder = decoding.createDecoder(update)
  const count = decoding.readVarUint(decoder)
  const entries: AwarenessEntry[] = []
  for (let i = 0; i < count; i++) {
    const clientId = decoding.readVarUint(decoder)
    const clock = decoding.readVarUint(decoder)
    const state = JSON.parse(decoding.readVarString(decoder)) as unknown
    entries.push({ clientId, clock, state })
  }
  return entries
}

export function encodeAwarenessEntries(entries: AwarenessEntry[]): Uint8Array {
  const encoder = encoding.createEncoder()
  encoding.writeVarUint(encoder, entries.length)
  for (const entry of entries) {
    encoding.writeVarUint(encoder, entry.clientId)
    encoding.writeVarUint(encoder, entry.clock)
    encoding.writeVarString(encoder, JSON.stringify(entry.state))
  }
  return encoding.toUint8Array(encoder)
}

export function presenceUserOf(identity: LiveIdentity): PresenceUser {
  return { id: identity.userId, name: identity.name, colour: identity.colour, role: identity.role }
}

/**
 * Rewrites a peer's awareness update: entries for client ids owned by someone else are dropped,
 * the rest carry the server's identity. Returns the update to apply and the client ids it claims.
 */
export function stampAwarenessUpdate(
  update: Uint8Array,
  identity: LiveIdentity,
  isOwnedByOther: (clientId: number) => boolean,
): { update: Uint8Array, clientIds: number[] } {
  const user = presenceUserOf(identity)
  const kept = decodeAwarenessUpdate(update)
    .filter(entry => !isOwnedByOther(entry.clientId))
    .map(entry => ({ ...entry, state: entry.state === null ? null : sanitizePresence(entry.state, user) }))
  return { update: encodeAwarenessEntries(kept), clientIds: kept.map(e => e.clientId) }
}

/** Removes states not renewed within maxAgeMs (clients renew every 15 s); returns the ids removed. */
export function removeStalePresence(awareness: awarenessProtocol.Awareness, maxAgeMs: number, now = Date.now()): number[] {
  const stale: number[] = []
  awareness.meta.forEach((meta, clientId) => {
    if (clientId !== awareness.clientID && awareness.states.has(clientId) && now - meta.lastUpdated >= maxAgeMs) {
      stale.push(clientId)
    }
  })
  if (stale.length) awarenessProtocol.removeAwarenessStates(awareness, stale, 'stale')
  return stale
}
