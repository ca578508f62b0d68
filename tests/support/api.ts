// A small JSON client for route tests against one server, and a POST from a chosen loopback source
// address (127.0.0.x), as a different client machine would send it.
import { request } from 'node:http'
import { cookieFrom } from './auth'

export interface ApiAnswer {
  status: number
  json: any
  cookie: string
  res: Response
}

export function apiClient(base: string) {
  return async function api(method: string, path: string, options: { body?: unknown, cookie?: string, headers?: Record<string, string> } = {}): Promise<ApiAnswer> {
    const headers: Record<string, string> = { ...options.headers }
    if (options.cookie) headers.cookie = options.cookie
    if (options.body !== undefined) headers['content-type'] = 'application/json'
    const res = await fetch(`${base}${path}`, { method, headers, body: options.body === undefined ? undefined : JSON.stringify(options.body) })
    const text = await res.text()
    let json: unknown = null
    try {
      json = text ? JSON.parse(text) : null
    }
    catch {
      json = { notJson: text.slice(0, 200) }
    }
    return { status: res.status, json, cookie: cookieFrom(res), res }
  }
}

export function postFrom(base: string, localAddress: string, path: string, body: unknown, extraHeaders: Record<string, string> = {}): Promise<number> {
  const payload = JSON.stringify(body)
  return new Promise((ok, fail) => {
    const req = request(`${base}${path}`, {
      method: 'POST', localAddress,
      headers: { 'content-type': 'application/json', 'content-length': Buffer.byteLength(payload), ...extraHeaders },
    }, (res) => {
      res.resume()
      res.on('end', () => ok(res.statusCode!))
    })
    req.on('error', fail)
    req.end(payload)
  })
}
