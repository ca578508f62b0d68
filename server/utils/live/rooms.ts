// Live rooms: one in-memory Y.Doc per open board, shared by every connection to that board.
// A room loads its state before it sends anyone a sync message (frames that arrive meanwhile are
// queued), appends every accepted update to the board's update log within logIntervalMs (what a
// crash can lose), compacts the log into the full state through a debounced scheduler, flushes
// both when the last peer leaves, and a failed load closes every peer and never writes. Sockets and storage come in through small interfaces
// (./types) so tests drive this with a plain `ws` server.
import * as Y from 'yjs'
import * as decoding from 'lib0/decoding'
import * as syncProtocol from 'y-protocols/sync'
import * as awarenessProtocol from 'y-protocols/awareness'
import { applyBoardState, encodeBoardState } from '../../../shared/board/ydoc'
import {
  CLOSE_ACCESS_REVOKED, CLOSE_BOARD_GONE, CLOSE_DOCUMENT_TOO_LARGE, CLOSE_LOAD_FAILED, CLOSE_MALFORMED, CLOSE_MESSAGE_TOO_BIG,
  CLOSE_POLICY, CLOSE_ROLE_CHANGED, CLOSE_SHUTDOWN, MAX_FRAME_BYTES, MAX_FRAMES_BEFORE_READY,
  MESSAGE_AWARENESS, MESSAGE_QUERY_AWARENESS, MESSAGE_SYNC, encodeAccessNotice, type LiveRole,
} from '../../../shared/live/protocol'
import { awarenessFrame, syncStep1Frame, syncStep2FrameOf, syncUpdateFrame, updateHasContent } from './protocol'
import { removeStalePresence, stampAwarenessUpdate } from './presence'
import { createSaveScheduler, type SaveScheduler } from './persistence'
import { createUpdateLog, type UpdateLog } from './update-log'
import { linkRoom, ORIGIN_REMOTE, type RelayBus, type RoomLink } from './relay'
import { DEFAULT_LIMITS, DEFAULT_TIMINGS, type BoardStateStore, type LiveLimits, type LiveIdentity, type LiveSocket, type LiveTimings } from './types'

type RoomStatus = 'loading' | 'ready' | 'failed' | 'closed'

interface Room {
  boardId: string
  doc: Y.Doc
  awareness: awarenessProtocol.Awareness
  status: RoomStatus
  peers: Set<LiveConnection>
  /** Server-side edits in progress (snapshot restore); the room stays open while any run. */
  holds: number
  ready: Promise<void>
  saver?: SaveScheduler
  log?: UpdateLog
  /** With several nodes: the board's channel to the others (see ./relay). */
  link?: RoomLink
  /** The whole document encoded once, until the next change (sync answers share it). */
  encoded?: Uint8Array
  /** Sync step 2 answers by the asker's state vector, until the next change. */
  answers: Map<string, Uint8Array>
  /** Encoded size at the last exact count plus every update since (an upper estimate). */
  sizeEstimate: number
}

export interface LiveConnection {
  readonly boardId: string
  readonly identity: LiveIdentity
  readonly socket: LiveSocket
  /** Awareness client ids this connection has published; cleared when it closes. */
  readonly clientIds: Set<number>
  queue: Uint8Array[]
  lastFrameAt: number
  lastDropNoticeAt: number
  /** Token bucket of the frame-rate cap. */
  frameTokens: number
  frameTokensAt: number
  isClosed: boolean
}

export interface LiveHubOptions {
  store: BoardStateStore
  timings?: Partial<LiveTimings>
  limits?: Partial<LiveLimits>
  log?: Pick<Console, 'error' | 'warn'>
  /** Joins the rooms to the other nodes' copies (Redis); absent on a single node. */
  relay?: RelayBus
}

const canEdit = (role: LiveRole) => role === 'admin' || role === 'designer'

export function createLiveHub(options: LiveHubOptions) {
  const { store } = options
  const timings: LiveTimings = { ...DEFAULT_TIMINGS, ...options.timings }
  const limits: LiveLimits = { ...DEFAULT_LIMITS, ...options.limits }
  const log = options.log ?? console
  const rooms = new Map<string, Room>()
  const connections = new Set<LiveConnection>()
  let isShuttingDown = false

  const send = (conn: LiveConnection, frame: Uint8Array) => {
    if (conn.isClosed) return
    // A peer that does not read would make the server hold every answer: end it instead.
    if ((conn.socket.bufferedAmount?.() ?? 0) + frame.byteLength > limits.maxPendingSendBytes) {
      log.warn(`[live] user ${conn.identity.userId} is not reading on ${conn.boardId}; ending the connection`)
      return drop(conn, CLOSE_POLICY, 'not reading', true)
    }
    try {
      conn.socket.send(frame)
    }
    catch (error) {
      log.warn('[live] send failed, closing the connection', error)
      drop(conn, 1011, 'send failed')
    }
  }

  const broadcast = (room: Room, frame: Uint8Array, except?: unknown) => {
    for (const peer of room.peers) if (peer !== except) send(peer, frame)
  }

  function openRoom(boardId: string): Room {
    const doc = new Y.Doc()
    const awareness = new awarenessProtocol.Awareness(doc)
    // The server is not a participant: it publishes no presence of its own.
    awareness.setLocalState(null)
    const room = { boardId, doc, awareness, status: 'loading', peers: new Set(), holds: 0, answers: new Map(), sizeEstimate: 0 } as Omit<Room, 'ready'> as Room
    rooms.set(boardId, room)
    if (options.relay) {
      room.link = linkRoom({
        bus: options.relay, boardId, doc, awareness, log,
        localClientIds: () => [...room.peers].flatMap(peer => [...peer.clientIds]),
      })
    }
    // Subscribed before loading: whatever another node publishes meanwhile is queued, not lost.
    const subscribed = room.link?.subscribed ?? Promise.resolve()
    room.ready = subscribed.then(() => store.loadState(boardId)).then(
      (stored) => {
        if (room.status !== 'loading') return
        if (stored === null) {
          failRoom(room, CLOSE_BOARD_GONE, 'board not found')
          throw new Error(`board ${boardId} not found`)
        }
        const { state, logId } = stored instanceof Uint8Array ? { state: stored, logId: 0 } : stored
        try {
          applyBoardState(doc, state)
          room.sizeEstimate = state.byteLength
        }
        catch (error) {
          // A stored state that does not decode must not be overwritten by an empty document.
          log.error(`[live] stored state of board ${boardId} does not decode`, error)
          failRoom(room, CLOSE_LOAD_FAILED, 'board could not be loaded')
          throw error
        }
        becomeReady(room, logId)
      },
      (error) => {
        log.error(`[live] loading board ${boardId} failed`, error)
        failRoom(room, CLOSE_LOAD_FAILED, 'board could not be loaded')
        throw error
      },
    )
    // Peers learn of a failure through their close frame; only server-side edits await this.
    room.ready.catch(() => {})
    return room
  }

  function becomeReady(room: Room, loadedLogId: number) {
    const { doc, awareness, boardId } = room
    const appendUpdate = store.appendUpdate?.bind(store)
    if (appendUpdate) {
      room.log = createUpdateLog({
        append: update => appendUpdate(boardId, update),
        intervalMs: timings.logIntervalMs,
        retryMs: timings.saveDebounceMs,
        initialId: loadedLogId,
        onError: error => log.error(`[live] logging updates of board ${boardId} failed; will retry`, error),
      })
    }
    room.saver = createSaveScheduler({
      // The log rows stored before this encoding are all in it (lastId is read first).
      save: () => {
        const covered = room.log?.lastId ?? 0
        return store.saveState(boardId, encodeBoardState(doc), covered)
      },
      debounceMs: timings.saveDebounceMs,
      maxWaitMs: timings.saveMaxWaitMs,
      onError: error => log.error(`[live] saving board ${boardId} failed; will retry`, error),
    })
    // Listeners attach after the load, so loading itself never counts as an edit.
    // Every node saves what it holds, remote changes included, so a node that dies before its
    // save loses nothing another node has (saves merge with the stored state: board-store.ts).
    doc.on('update', (update: Uint8Array, origin: unknown) => {
      room.encoded = undefined
      room.answers.clear()
      room.sizeEstimate += update.byteLength
      // Each node logs the updates it accepted itself; remote ones are logged by their own node
      // (and a node that dies before that still has them in every other node's next save).
      if (origin !== ORIGIN_REMOTE) room.log?.push(update)
      room.saver!.markDirty()
      broadcast(room, syncUpdateFrame(update), origin)
      if (origin !== ORIGIN_REMOTE) room.link?.publishUpdate(update)
    })
    awareness.on('update', ({ added, updated, removed }: { added: number[], updated: number[], removed: number[] }, origin: unknown) => {
      const changed = [...added, ...updated, ...removed]
      broadcast(room, awarenessFrame(awareness, changed), origin)
      if (origin !== ORIGIN_REMOTE) room.link?.publishAwareness(awarenessProtocol.encodeAwarenessUpdate(awareness, changed))
    })
    room.status = 'ready'
    // A log left by a crash is compacted into the state soon, in the background.
    if (loadedLogId > 0) room.saver.markDirty()
    for (const peer of [...room.peers]) {
      welcome(room, peer)
      const queued = peer.queue
      peer.queue = []
      for (const frame of queued) handleFrame(room, peer, frame)
    }
    room.link?.start()
    if (room.peers.size === 0 && room.holds === 0) void unloadWhenEmpty(room)
  }

  function failRoom(room: Room, code: number, reason: string) {
    room.status = 'failed'
    if (rooms.get(room.boardId) === room) rooms.delete(room.boardId)
    for (const peer of [...room.peers]) drop(peer, code, reason)
    room.saver?.dispose()
    room.log?.dispose()
    room.link?.close()
    room.doc.destroy()
  }

  function welcome(room: Room, conn: LiveConnection) {
    send(conn, encodeAccessNotice({ readOnly: !canEdit(conn.identity.role), role: conn.identity.role }))
    send(conn, syncStep1Frame(room.doc))
    const others = [...room.awareness.getStates().keys()]
    if (others.length) send(conn, awarenessFrame(room.awareness, others))
  }

  function handleFrame(room: Room, conn: LiveConnection, frame: Uint8Array) {
    if (conn.isClosed) return
    try {
      const decoder = decoding.createDecoder(frame)
      const type = decoding.readVarUint(decoder)
      if (type === MESSAGE_SYNC) handleSync(room, conn, decoder)
      else if (type === MESSAGE_AWARENESS) handleAwareness(room, conn, decoding.readVarUint8Array(decoder))
      else if (type === MESSAGE_QUERY_AWARENESS) send(conn, awarenessFrame(room.awareness, [...room.awareness.getStates().keys()]))
      // Auth frames and anything unknown are ignored, as y-websocket's own server does.
    }
    catch (error) {
      log.warn(`[live] malformed frame from user ${conn.identity.userId} on ${room.boardId}`, error)
      drop(conn, CLOSE_MALFORMED, 'malformed frame')
    }
  }

  function handleSync(room: Room, conn: LiveConnection, decoder: decoding.Decoder) {
    const kind = decoding.readVarUint(decoder)
    if (kind === syncProtocol.messageYjsSyncStep1) {
      send(conn, syncAnswer(room, decoding.readVarUint8Array(decoder)))
      return
    }
    if (kind !== syncProtocol.messageYjsSyncStep2 && kind !== syncProtocol.messageYjsUpdate) {
      throw new Error(`unknown sync message ${kind}`)
    }
    const update = decoding.readVarUint8Array(decoder)
    if (!canEdit(conn.identity.role)) {
      // WARNING: a reviewer's document changes are dropped here, never applied or relayed.
      if (updateHasContent(update)) noticeDropped(conn)
      return
    }
    if (room.sizeEstimate + update.byteLength > limits.maxDocBytes) {
      room.sizeEstimate = encodedState(room).byteLength
      if (room.sizeEstimate + update.byteLength > limits.maxDocBytes) {
        log.warn(`[live] board ${room.boardId} is at its ${limits.maxDocBytes} byte cap; refusing an edit from user ${conn.identity.userId}`)
        return drop(conn, CLOSE_DOCUMENT_TOO_LARGE, 'document too large')
      }
    }
    // Origin = the sending connection, so the broadcast skips it.
    Y.applyUpdate(room.doc, update, conn)
  }

  function encodedState(room: Room): Uint8Array {
    room.encoded ??= Y.encodeStateAsUpdate(room.doc)
    return room.encoded
  }

  /**
   * The sync step 2 answer to a state vector, encoded once per document version: a peer asking
   * again and again (or many peers asking at once) get the same bytes, never a fresh copy each.
   */
  function syncAnswer(room: Room, stateVector: Uint8Array): Uint8Array {
    const key = stateVector.byteLength <= 4096 ? Buffer.from(stateVector).toString('base64') : undefined
    const cached = key === undefined ? undefined : room.answers.get(key)
    if (cached) return cached
    const isEmpty = stateVector.byteLength === 1 && stateVector[0] === 0
    const answer = syncStep2FrameOf(isEmpty ? encodedState(room) : Y.encodeStateAsUpdate(room.doc, stateVector))
    if (key !== undefined) {
      if (room.answers.size >= 16) room.answers.clear()
      room.answers.set(key, answer)
    }
    return answer
  }

  function noticeDropped(conn: LiveConnection) {
    const now = Date.now()
    if (now - conn.lastDropNoticeAt < 5000) return
    conn.lastDropNoticeAt = now
    send(conn, encodeAccessNotice({ readOnly: true, role: conn.identity.role, dropped: true }))
  }

  function handleAwareness(room: Room, conn: LiveConnection, update: Uint8Array) {
    const isOwnedByOther = (clientId: number) => {
      for (const peer of room.peers) if (peer !== conn && peer.clientIds.has(clientId)) return true
      return room.link?.isRemoteClient(clientId) ?? false
    }
    const stamped = stampAwarenessUpdate(update, conn.identity, isOwnedByOther)
    for (const id of stamped.clientIds) conn.clientIds.add(id)
    awarenessProtocol.applyAwarenessUpdate(room.awareness, stamped.update, conn)
  }

  async function unloadWhenEmpty(room: Room) {
    if (room.status !== 'ready' || room.peers.size > 0 || room.holds > 0) return
    await flushRoom(room)
    // Someone may have joined while the save ran; then the room stays.
    if (room.peers.size > 0 || room.holds > 0 || room.status !== 'ready') return
    room.status = 'closed'
    room.saver!.dispose()
    room.log?.dispose()
    room.link?.close()
    if (rooms.get(room.boardId) === room) rooms.delete(room.boardId)
    room.doc.destroy()
  }

  /** Closes a connection from the server side (at once, dropping its queue, when `isAbrupt`) and forgets it. */
  function drop(conn: LiveConnection, code: number, reason: string, isAbrupt = false) {
    if (conn.isClosed) return
    try {
      if (isAbrupt && conn.socket.terminate) conn.socket.terminate()
      else conn.socket.close(code, reason)
    }
    catch { /* already gone */ }
    leave(conn)
  }

  function join(boardId: string, socket: LiveSocket, identity: LiveIdentity): LiveConnection {
    const conn: LiveConnection = {
      boardId, identity, socket, clientIds: new Set(), queue: [], lastFrameAt: Date.now(), lastDropNoticeAt: 0, isClosed: false,
      frameTokens: limits.frameBurst, frameTokensAt: Date.now(),
    }
    if (isShuttingDown) {
      conn.isClosed = true
      socket.close(CLOSE_SHUTDOWN, 'server restarting')
      return conn
    }
    connections.add(conn)
    const room = rooms.get(boardId) ?? openRoom(boardId)
    room.peers.add(conn)
    if (room.status === 'ready') welcome(room, conn)
    return conn
  }

  function receive(conn: LiveConnection, frame: Uint8Array) {
    if (conn.isClosed) return
    if (frame.byteLength > MAX_FRAME_BYTES) return drop(conn, CLOSE_MESSAGE_TOO_BIG, 'frame above 1 MB')
    const now = Date.now()
    conn.frameTokens = Math.min(limits.frameBurst, conn.frameTokens + (now - conn.frameTokensAt) * limits.framesPerSecond / 1000)
    conn.frameTokensAt = now
    if (conn.frameTokens < 1) return drop(conn, CLOSE_POLICY, 'too many frames')
    conn.frameTokens -= 1
    conn.lastFrameAt = now
    const room = rooms.get(conn.boardId)
    if (!room || !room.peers.has(conn)) return
    if (room.status !== 'ready') {
      if (conn.queue.length >= MAX_FRAMES_BEFORE_READY) return drop(conn, CLOSE_POLICY, 'too many frames before the board loaded')
      conn.queue.push(frame)
      return
    }
    handleFrame(room, conn, frame)
  }

  function leave(conn: LiveConnection) {
    if (conn.isClosed && !connections.has(conn)) return
    conn.isClosed = true
    conn.queue = []
    connections.delete(conn)
    const room = rooms.get(conn.boardId)
    if (!room || !room.peers.delete(conn)) return
    if (room.status === 'ready' && conn.clientIds.size) {
      awarenessProtocol.removeAwarenessStates(room.awareness, [...conn.clientIds], conn)
    }
    if (room.peers.size === 0 && room.holds === 0) void unloadWhenEmpty(room).catch(error => log.error('[live] unload failed', error))
  }

  const matches = (conn: LiveConnection, userId: number, workspaceId?: number) =>
    conn.identity.userId === userId && (workspaceId === undefined || conn.identity.workspaceId === workspaceId)

  /** Closes every live connection of a user (in one workspace, or everywhere); returns how many. */
  function closeSocketsOf(userId: number, workspaceId?: number, reason = 'access revoked'): number {
    const hits = [...connections].filter(conn => matches(conn, userId, workspaceId))
    for (const conn of hits) drop(conn, CLOSE_ACCESS_REVOKED, reason)
    return hits.length
  }

  /** Closes the connections opened with one session (that session signed out); returns how many. */
  function closeSession(sessionKey: string): number {
    const hits = [...connections].filter(conn => conn.identity.sessionKey === sessionKey)
    for (const conn of hits) drop(conn, CLOSE_ACCESS_REVOKED, 'signed out')
    return hits.length
  }

  /** The board was deleted: its peers are closed and its room is dropped without another save. */
  function closeBoard(boardId: string): number {
    const room = rooms.get(boardId)
    if (!room) return 0
    const count = room.peers.size
    failRoom(room, CLOSE_BOARD_GONE, 'board deleted')
    return count
  }

  /**
   * After a role change: connections holding another role are closed with a retryable code, so the
   * client reconnects and the upgrade grants the new role. A null role means the member was removed.
   */
  function refreshRole(userId: number, workspaceId: number, role: LiveRole | null): number {
    if (role === null) return closeSocketsOf(userId, workspaceId, 'membership removed')
    const hits = [...connections].filter(conn => matches(conn, userId, workspaceId) && conn.identity.role !== role)
    for (const conn of hits) drop(conn, CLOSE_ROLE_CHANGED, 'role changed')
    return hits.length
  }

  /** Stale presence and silent connections; runs on a timer, exposed for tests. */
  function sweep(now = Date.now()) {
    for (const room of rooms.values()) {
      if (room.status === 'ready') removeStalePresence(room.awareness, timings.presenceMaxAgeMs, now)
    }
    for (const conn of [...connections]) {
      if (now - conn.lastFrameAt > timings.idleCloseMs) drop(conn, 1001, 'idle')
    }
  }
  options.relay?.onResume?.(() => {
    for (const room of rooms.values()) if (room.status === 'ready') room.link?.resync()
  })
  const sweeper = setInterval(() => sweep(), timings.sweepIntervalMs)
  sweeper.unref?.()

  /** The log first, then the full state that covers it (so the log rows are dropped at once). */
  async function flushRoom(room: Room): Promise<void> {
    await room.log?.flush()
    await room.saver?.flush()
  }

  /** Writes every room with unsaved changes and waits for the writes. */
  async function flushAll(): Promise<void> {
    await Promise.all([...rooms.values()].map(flushRoom))
  }

  /** Refuses new peers, flushes every room, then closes all connections. */
  async function shutdown(): Promise<void> {
    isShuttingDown = true
    clearInterval(sweeper)
    await flushAll()
    for (const conn of [...connections]) drop(conn, CLOSE_SHUTDOWN, 'server restarting')
    await flushAll()
  }

  /**
   * Runs a server-side edit (e.g. a snapshot restore) on the board's live document: the open room's
   * doc when someone is connected (so they see it at once), else the stored state loaded for the
   * purpose. The change is broadcast like any edit and written before this resolves.
   */
  async function editBoard<T>(boardId: string, edit: (doc: Y.Doc) => T): Promise<T> {
    if (isShuttingDown) throw new Error('server is shutting down')
    const room = rooms.get(boardId) ?? openRoom(boardId)
    room.holds++
    try {
      await room.ready
      if (room.status !== 'ready') throw new Error(`board ${boardId} is not open`)
      const result = edit(room.doc)
      await room.saver!.flush()
      return result
    }
    finally {
      room.holds--
      if (room.peers.size === 0 && room.holds === 0) void unloadWhenEmpty(room).catch(error => log.error('[live] unload failed', error))
    }
  }

  function stats() {
    return { rooms: rooms.size, connections: connections.size }
  }

  /** The room's current document, for tests and snapshot routes (undefined when not open). */
  function openDoc(boardId: string): Y.Doc | undefined {
    const room = rooms.get(boardId)
    return room?.status === 'ready' ? room.doc : undefined
  }

  /** Who has the board open now: one entry per person (several tabs count once), server-stamped. */
  function presentIn(boardId: string): { userId: number, name: string, colour: string }[] {
    const room = rooms.get(boardId)
    if (!room) return []
    const people = new Map<number, { userId: number, name: string, colour: string }>()
    for (const peer of room.peers) {
      if (peer.isClosed) continue
      const { userId, name, colour } = peer.identity
      people.set(userId, { userId, name, colour })
    }
    return [...people.values()]
  }

  /** Boards with a room on this node. */
  function openBoards(): string[] {
    return [...rooms.keys()]
  }

  return { join, receive, leave, closeSocketsOf, closeSession, closeBoard, refreshRole, sweep, flushAll, shutdown, stats, openDoc, editBoard, presentIn, openBoards }
}

export type LiveHub = ReturnType<typeof createLiveHub>
