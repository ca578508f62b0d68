// The Content-Security-Policy of the HTML pages, with a fresh nonce per page for the scripts Nuxt
// writes into it (its config and payload scripts), and no `x-powered-by`. The headers every
// response gets (nosniff, framing, referrer) are route rules in nuxt.config.ts.
// What the policy must allow, and why: scripts and workers from our own origin (Vite's chunks; the
// match search worker, which may start from a blob: URL), the live WebSocket back to our own origin
// ('self' covers ws:/wss: to the same host in CSP Level 3), the Work Sans files we ship, images
// the chart exports (data:/blob:). Styles allow 'unsafe-inline': Vue renders :style bindings as
// style attributes, which no nonce can cover. Nothing is framed, posted or loaded from elsewhere.
import { randomBytes } from 'node:crypto'

export function pagePolicy(nonce: string): string {
  return [
    "default-src 'self'",
    `script-src 'self' 'nonce-${nonce}'`,
    "worker-src 'self' blob:",
    "connect-src 'self'",
    "style-src 'self' 'unsafe-inline'",
    "img-src 'self' data: blob:",
    "font-src 'self' data:",
    "object-src 'none'",
    "base-uri 'self'",
    "form-action 'self'",
    "frame-ancestors 'none'",
  ].join('; ')
}

export default defineNitroPlugin((nitroApp) => {
  nitroApp.hooks.hook('render:html', (html, { event }) => {
    const nonce = randomBytes(16).toString('base64')
    event.context.cspNonce = nonce
    // Only the framework's own chunks: the app body is never given a nonce.
    const withNonce = (chunk: string) => chunk.replace(/<script\b/g, `<script nonce="${nonce}"`)
    html.head = html.head.map(withNonce)
    html.bodyAppend = html.bodyAppend.map(withNonce)
  })
  nitroApp.hooks.hook('render:response', (response, { event }) => {
    if (!response.headers) response.headers = {}
    delete response.headers['x-powered-by']
    const nonce = event.context.cspNonce as string | undefined
    if (nonce) response.headers['content-security-policy'] = pagePolicy(nonce)
  })
})
