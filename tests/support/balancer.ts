// A stand-in for the load balancer in front of several nodes: a TCP pass-through on loopback (so
// WebSocket upgrades pass untouched) that hands each new connection to the next node in turn and,
// when that node refuses, to the one after it. No stickiness, as the nodes need none.
import { connect, createServer, type Socket } from 'node:net'

export interface Balancer {
  url: string
  /** How many connections each backend port has taken. */
  counts: Map<number, number>
  close: () => Promise<void>
}

export async function startBalancer(backendPorts: number[]): Promise<Balancer> {
  let next = 0
  const counts = new Map(backendPorts.map(port => [port, 0]))
  const sockets = new Set<Socket>()
  const server = createServer((client) => {
    sockets.add(client)
    client.on('close', () => sockets.delete(client))
    client.pause()
    const tryBackend = (attempt: number) => {
      if (attempt >= backendPorts.length) return client.destroy()
      const port = backendPorts[next++ % backendPorts.length]!
      const upstream = connect({ host: '127.0.0.1', port })
      let connected = false
      upstream.once('connect', () => {
        connected = true
        counts.set(port, counts.get(port)! + 1)
        sockets.add(upstream)
        upstream.on('close', () => { sockets.delete(upstream); client.destroy() })
        client.on('close', () => upstream.destroy())
        upstream.on('error', () => client.destroy())
        client.on('error', () => upstream.destroy())
        client.pipe(upstream)
        upstream.pipe(client)
        client.resume()
      })
      upstream.once('error', () => {
        // Refused (the node is down): the next one gets this connection.
        if (!connected) tryBackend(attempt + 1)
      })
    }
    tryBackend(0)
  })
  await new Promise<void>(ok => server.listen(0, '127.0.0.1', ok))
  const { port } = server.address() as { port: number }
  return {
    url: `http://127.0.0.1:${port}`,
    counts,
    close: () => new Promise<void>((ok) => {
      for (const socket of sockets) socket.destroy()
      server.close(() => ok())
    }),
  }
}
