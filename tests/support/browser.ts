// Chromium for browser tests: the Debian binary, headless, with the flags that keep it quiet and
// offline (never a downloaded browser).
import { mkdirSync } from 'node:fs'
import { chromium, type Browser } from 'playwright-core'
import { afterAll, beforeAll } from 'vitest'

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
