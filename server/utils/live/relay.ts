// Live rooms across nodes: every node that has a board open subscribes to that board's Redis
// channel. What a node's own clients send is checked there (rooms.ts: reviewers' updates dropped,
// presence stamped) and then published; the other nodes apply it to their copy, which sends it on
// to their clients. Each message carries its node's id, so a node ignores its own echo. Redis
// holds no document state: the database does (see DEVELOPERS.md, "Several nodes").
import * as Y from 'yjs'
import * as decoding from 'lib0/decoding'
import * as encoding from 'lib0/encoding'
import * as awarenessProtocol from 'y-protocols/awareness'
import { decodeAwarenessUpdate } from './presence'

/** Origin of changes that came from another node: applied and forwarded, never published again. */
export const ORIGIN_REMOTE = Symbol('remote node')

const KIND_UPDATE = 0
const KIND_AWARENESS = 1
/** A state vector: answer with what the sender lacks (and, when asked, with your own vector). */
const KIND_SYNC = 2

export interface RelayMessage {
  kind: number
  nodeId: string
  payload: Uint8Array
  wantsReply: boolean
}

export function encodeRelayMessage(message: RelayMessage): Uint8Array {
  const encoder = encoding.createEncoder()
  encoding.writeVarUint(encoder, message.kind)
  encoding.writeVarString(encoder, message.nodeId)
  encoding.writeVarUint8Array(encoder, message.payload)
  encoding.writeVarUint(encoder, message.wantsReply ? 1 : 0)
  return encoding.toUint8Array(encoder)
}

export function decodeRelayMessage(bytes: Uint8Array): RelayMessage {
  const decoder = decoding.createDecoder(bytes)
  const kind = decoding.readVarUint(decoder)
  const nodeId = decoding.readVarString(decoder)
  const payload = decoding.readVarUint8Array(decoder)
  const wantsReply = decoding.readVarUint(decoder) === 1
  return { kind, nodeId, payload, wantsReply }
}

/** The transport: one channel per board. */
export interface RelayBus {
  readonly nodeId: string
  subscribe(boardId: string, onMessage: (bytes: Uint8Array) => void): Promise<void>
  unsubscribe(boardId: string): void
  publish(boardId: string, bytes: Uint8Array): void
  /** Called after the transport reconnected (messages may have been missed meanwhile). */
  onResume?(listener: () => void): void
}

/** One open room's link to the other nodes. */
export interface RoomLink {
  /** Resolves once subscribed; the room loads after this, so nothing published meanwhile is lost. */
  readonly subscribed: Promise<void>
  /** After the load: applies what arrived meanwhile, then asks the other nodes for what this copy lacks. */
  start(): void
  /** Asks the other nodes again for what this copy lacks (after a lost connection). */
  resync(): void
  publishUpdate(update: Uint8Array): void
  publishAwareness(update: Uint8Array): void
  /** True when the awareness client id was last published by a peer on another node. */
  isRemoteClient(clientId: number): boolean
  close(): void
}

export interface RoomLinkOptions {
  bus: RelayBus
  boardId: string
  doc: Y.Doc
  awareness: awarenessProtocol.Awareness
  /** Awareness client ids of this node's own peers (sent to a node that joins). */
  localClientIds: () => number[]
  log?: Pick<Console, 'warn'>
}

export function linkRoom(options: RoomLinkOptions): RoomLink {
  const { bus, boardId, doc, awareness } = options
  const log = options.log ?? console
  const remoteClients = new Set<number>()
  let queue: RelayMessage[] | undefined = []
  let closed = false

  const publish = (kind: number, payload: Uint8Array, wantsReply = false) => {
    if (!closed) bus.publish(boardId, encodeRelayMessage({ kind, nodeId: bus.nodeId, payload, wantsReply }))
  }

  const handle = (message: RelayMessage) => {
    if (message.kind === KIND_UPDATE) {
      Y.applyUpdate(doc, message.payload, ORIGIN_REMOTE)
    }
    else if (message.kind === KIND_AWARENESS) {
      for (const entry of decodeAwarenessUpdate(message.payload)) {
        if (entry.state === null) remoteClients.delete(entry.clientId)
        else remoteClients.add(entry.clientId)
      }
      awarenessProtocol.applyAwarenessUpdate(awareness, message.payload, ORIGIN_REMOTE)
    }
    else if (message.kind === KIND_SYNC) {
      // The diff is published to the channel: other nodes that lack the same part take it too.
      const missing = Y.encodeStateAsUpdate(doc, message.payload)
      if (updateCarriesContent(missing)) publish(KIND_UPDATE, missing)
      if (message.wantsReply) {
        publish(KIND_SYNC, Y.encodeStateVector(doc))
        const own = options.localClientIds().filter(id => awareness.meta.has(id))
        if (own.length) publish(KIND_AWARENESS, awarenessProtocol.encodeAwarenessUpdate(awareness, own))
      }
    }
  }

  const subscribed = bus.subscribe(boardId, (bytes) => {
    if (closed) return
    let message: RelayMessage
    try {
      message = decodeRelayMessage(bytes)
    }
    catch (error) {
      log.warn(`[live] undecodable relay message on ${boardId}`, error)
      return
    }
    if (message.nodeId === bus.nodeId) return
    if (queue) queue.push(message)
    else safely(() => handle(message))
  })

  const safely = (run: () => void) => {
    try {
      run()
    }
    catch (error) {
      log.warn(`[live] relay message on ${boardId} could not be applied`, error)
    }
  }

  return {
    subscribed,
    start() {
      const pending = queue ?? []
      queue = undefined
      for (const message of pending) safely(() => handle(message))
      publish(KIND_SYNC, Y.encodeStateVector(doc), true)
    },
    resync() {
      if (!queue) publish(KIND_SYNC, Y.encodeStateVector(doc), true)
    },
    publishUpdate: update => publish(KIND_UPDATE, update),
    publishAwareness: update => publish(KIND_AWARENESS, update),
    isRemoteClient: clientId => remoteClients.has(clientId),
    close() {
      if (closed) return
      closed = true
      queue = undefined
      bus.unsubscribe(boardId)
    },
  }
}

/** An empty diff is a few bytes of zero counts; skip publishing those. */
function updateCarriesContent(update: Uint8Array): boolean {
  const { structs, ds } = Y.decodeUpdate(update)
  return structs.length > 0 || ds.clients.size > 0
}
