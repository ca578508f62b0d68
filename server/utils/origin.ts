import type { H3Event } from 'h3'

/** True when the request has no Origin, or an Origin equal to the request's own scheme://host:port. */
export function isSameOrigin(event: H3Event): boolean {
  const origin = getRequestHeader(event, 'origin')
  if (!origin) return true
  const own = getRequestURL(event, { xForwardedHost: false, xForwardedProto: false }).origin
  return origin === own
}
