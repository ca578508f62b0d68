// Signing in from tests: over the API (returns the Cookie header value to send on later requests)
// and for a Playwright page (the same session cookie added to its browser context).
import type { Page } from 'playwright-core'

export const DEMO_USERS = {
  admin: { email: 'mara@brackwater.example', password: 'brackwater-admin-demo', name: 'Mara Quell' },
  designer: { email: 'tomas@brackwater.example', password: 'brackwater-designer-demo', name: 'Tomas Reyes' },
  reviewer: { email: 'ines@brackwater.example', password: 'brackwater-reviewer-demo', name: 'Ines Halvorsen' },
} as const

/** The `name=value` pairs of a response's Set-Cookie headers, ready for a Cookie header. */
export function cookieFrom(res: Response): string {
  return res.headers.getSetCookie().map(c => c.split(';')[0]).join('; ')
}

/** Signs in through POST /api/auth/login and returns the Cookie header value; throws on failure. */
export async function signIn(baseUrl: string, email: string, password: string): Promise<string> {
  const res = await fetch(`${baseUrl}/api/auth/login`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ email, password }),
  })
  if (!res.ok) throw new Error(`sign-in as ${email} failed: ${res.status} ${await res.text()}`)
  const cookie = cookieFrom(res)
  if (!cookie) throw new Error(`sign-in as ${email} set no cookie`)
  return cookie
}

/** Signs the page's browser context in (the session cookie is shared by all its pages). */
export async function signInPage(page: Page, baseUrl: string, email: string, password: string): Promise<void> {
  const cookie = await signIn(baseUrl, email, password)
  await page.context().addCookies(cookie.split('; ').map((pair) => {
    const eq = pair.indexOf('=')
    return { name: pair.slice(0, eq), value: pair.slice(eq + 1), url: baseUrl }
  }))
}
