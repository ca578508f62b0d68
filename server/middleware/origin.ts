// Cross-site request refusal: an unsafe request (or the WebSocket upgrade, checked in its handler)
// that carries an Origin must come from our own origin (scheme, host and port of this request).
// Non-browser clients that send no Origin are accepted; the session cookie still guards them.
const SAFE = new Set(['GET', 'HEAD', 'OPTIONS'])

export default defineEventHandler((event) => {
  if (SAFE.has(event.method)) return
  if (!isSameOrigin(event)) {
    throw createError({ statusCode: 403, statusMessage: 'Forbidden', message: 'Cross-origin request refused: the Origin header does not match this site.' })
  }
})
