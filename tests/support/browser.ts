// Chromium for browser tests: the Debian binary, headless, with the flags that keep it quiet and
// offline (never a downloaded browser).
import { mkdirSync } from 'node:fs'
import { chromium, type Browser, type Page } from 'playwright-core'
import { afterAll, beforeAll } from 'vitest'
import { signInPage } from './auth'

export const CHROMIUM_ARGS = ['--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run',
  '--disable-background-networking', '--disable-component-update', '--disable-sync']

/** Screenshots for a person to look at (gitignored). */
export const ARTIFACTS = 'tests/artifacts'

export function launchChromium(): Promise<Browser> {
  return chromium.launch({ executablePath: '/usr/bin/chromium', headless: true, args: CHROMIUM_ARGS })
}

/** One Chromium for the calling test file: launched before its tests, closed after them. */
export function useChromium(): () => Browser {
  let browser: Browser | undefined
  beforeAll(async () => {
    mkdirSync(ARTIFACTS, { recursive: true })
    browser = await launchChromium()
  })
  afterAll(async () => { await browser?.close() })
  return () => browser!
}

/** A new page in its own browser context, signed in as `user` through the API. */
export async function signedInPage(
  browser: Browser, baseUrl: string, user: { email: string, password: string }, viewport: { width: number, height: number },
): Promise<Page> {
  const page = await (await browser.newContext({ viewport })).newPage()
  await signInPage(page, baseUrl, user.email, user.password)
  return page
}
