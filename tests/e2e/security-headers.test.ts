// The security headers in real Chromium: the board page carries a Content-Security-Policy (with a
// per-page script nonce), and under it the Konva chart draws, the Work Sans font loads, the live
// WebSocket syncs an edit between two pages and the yield worker runs, with no policy violation.
// Every response carries nosniff, a framing refusal and a referrer policy, and no x-powered-by.
import { describe, expect, inject, it } from 'vitest'
import type { Page } from 'playwright-core'
import { ARTIFACTS, signedInPage, useChromium } from '../support/browser'
import { DEMO_USERS, signIn } from '../support/auth'
import { createBoard } from '../live/helpers'

const baseUrl = inject('baseUrl')
const browser = useChromium()

/** Collects CSP violations (the DOM event, and Chromium's console report) from the page on. */
async function watchViolations(page: Page): Promise<string[]> {
  const violations: string[] = []
  page.on('console', (message) => {
    if (/Content Security Policy|Refused to/i.test(message.text())) violations.push(message.text())
  })
  await page.exposeFunction('__reportViolation', (text: string) => violations.push(text))
  await page.addInitScript(() => {
    document.addEventListener('securitypolicyviolation', (e) => {
      (window as unknown as { __reportViolation: (t: string) => void }).__reportViolation(`${e.violatedDirective} ${e.blockedURI} ${e.sourceFile}:${e.lineNumber}:${e.columnNumber}`)
    })
  })
  return violations
}

describe('security headers', () => {
  it('every response: nosniff, no framing, a referrer policy, no x-powered-by', async () => {
    for (const path of ['/login', '/api/health', '/api/nothing-here', '/favicon.ico']) {
      const res = await fetch(`${baseUrl}${path}`)
      expect(res.headers.get('x-content-type-options'), path).toBe('nosniff')
      expect(res.headers.get('x-frame-options'), path).toBe('DENY')
      expect(['same-origin', 'no-referrer'], path).toContain(res.headers.get('referrer-policy'))
      expect(res.headers.get('x-powered-by'), path).toBeNull()
    }
    const page = await fetch(`${baseUrl}/login`)
    const policy = page.headers.get('content-security-policy') ?? ''
    expect(policy).toMatch(/frame-ancestors 'none'/)
    expect(policy).toMatch(/script-src 'self' 'nonce-[A-Za-z0-9+/=]{16,}'/)
    expect(policy).toMatch(/worker-src 'self' blob:/)
    expect(policy).toMatch(/object-src 'none'/)
    // Each page gets its own nonce, and the inline scripts Nuxt writes carry it.
    const html = await page.text()
    const nonce = /'nonce-([^']+)'/.exec(policy)![1]!
    expect(html).toContain(`nonce="${nonce}"`)
    const other = (await fetch(`${baseUrl}/login`)).headers.get('content-security-policy')
    expect(other).not.toBe(policy)
  })

  it('the board renders, edits sync live and the yield worker runs, with no policy violation', async () => {
    const cookie = await signIn(baseUrl, DEMO_USERS.designer.email, DEMO_USERS.designer.password)
    const boardId = await createBoard(baseUrl, cookie, 'Policy board')
    const viewport = { width: 1440, height: 900 }
    const tomas = await signedInPage(browser(), baseUrl, DEMO_USERS.designer, viewport)
    const mara = await signedInPage(browser(), baseUrl, DEMO_USERS.admin, viewport)
    const seen = { tomas: await watchViolations(tomas), mara: await watchViolations(mara) }
    for (const page of [tomas, mara]) {
      const res = await page.goto(`${baseUrl}/boards/${boardId}`)
      expect(res!.headers()['content-security-policy']).toMatch(/script-src 'self' 'nonce-/)
      await page.locator('[data-testid="board"]').waitFor()
    }

    // The chart's canvas has drawn (Konva), in our own font.
    const drawn = await tomas.evaluate(() => [...document.querySelectorAll('canvas')].some((c) => {
      const ctx = c.getContext('2d')
      if (!ctx || !c.width || !c.height) return false
      return ctx.getImageData(0, 0, c.width, c.height).data.some((v, i) => i % 4 === 3 && v > 0)
    }))
    expect(drawn).toBe(true)
    await expect.poll(() => tomas.evaluate(async () => {
      await document.fonts.ready
      return document.fonts.check('16px "Work Sans"')
    })).toBe(true)

    // An element added on one page appears on the other through the live socket.
    const tiles = (page: Page) => page.locator('[data-testid="ladder-tile"]').count()
    const before = await tiles(mara)
    await tomas.locator('[data-testid="palette-toggle"]').click()
    await tomas.locator('[data-testid="palette"] button').first().click()
    await expect.poll(() => tiles(mara), { timeout: 5000 }).toBe(before + 1)

    // The Monte Carlo worker runs to the end.
    await tomas.locator('[data-testid="yield-panel"]').scrollIntoViewIfNeeded()
    await tomas.locator('[data-testid="yield-run"]').click()
    await expect.poll(() => tomas.locator('[data-testid="yield-value"]').textContent(), { timeout: 20_000 }).toMatch(/%/)

    await tomas.screenshot({ path: `${ARTIFACTS}/security-board.png` })
    expect([...seen.tomas, ...seen.mara]).toEqual([])
  })
})
