// Small additions to y-websocket's provider, shared by the browser composable and Node clients:
// our access notice (read-only or not), and reconnecting with jitter instead of its fixed steps.
import type { WebsocketProvider } from 'y-websocket'
import type * as decoding from 'lib0/decoding'
import { MESSAGE_ACCESS_NOTICE, readAccessNotice, type AccessNotice } from './protocol'
import { reconnectDelayMs } from './backoff'

type MessageHandler = (encoder: unknown, decoder: decoding.Decoder, provider: WebsocketProvider, emitSynced: boolean, messageType: number) => void

/** Calls onNotice whenever the server says whether this connection may edit. */
export function listenForAccessNotice(provider: WebsocketProvider, onNotice: (notice: AccessNotice) => void): void {
  const handlers = provider.messageHandlers as unknown as MessageHandler[]
  handlers[MESSAGE_ACCESS_NOTICE] = (_encoder, decoder) => onNotice(readAccessNotice(decoder))
}

/**
 * Replaces y-websocket's reconnect timer with a jittered one. Close codes 4400–4499 (access
 * revoked, board gone) still stop reconnecting, as y-websocket decides. Returns a detach function.
 */
export function reconnectWithJitter(provider: WebsocketProvider, random: () => number = Math.random): () => void {
  let timer: ReturnType<typeof setTimeout> | undefined
  const onClose = (event: { code: number } | null) => {
    if (!provider.shouldConnect) return // the app called disconnect()
    if (event && event.code >= 4400 && event.code < 4500) return
    // With shouldConnect false, y-websocket's own scheduled attempt does nothing.
    provider.shouldConnect = false
    const delay = reconnectDelayMs(provider.wsUnsuccessfulReconnects + 1, random, provider.maxBackoffTime)
    timer = setTimeout(() => {
      timer = undefined
      provider.connect()
    }, delay)
  }
  const disconnect = provider.disconnect.bind(provider)
  provider.disconnect = () => {
    if (timer) clearTimeout(timer)
    timer = undefined
    disconnect()
  }
  provider.on('connection-close', onClose as never)
  return () => {
    if (timer) clearTimeout(timer)
    provider.off('connection-close', onClose as never)
    provider.disconnect = disconnect
  }
}
