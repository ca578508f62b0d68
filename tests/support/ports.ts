// A free TCP port on loopback, for the servers the tests start.
import { createServer } from 'node:net'

export async function freePort(): Promise<number> {
  return new Promise((ok, fail) => {
    const srv = createServer()
    srv.unref()
    srv.on('error', fail)
    srv.listen(0, '127.0.0.1', () => {
      const { port } = srv.address() as { port: number }
      srv.close(() => ok(port))
    })
  })
}
