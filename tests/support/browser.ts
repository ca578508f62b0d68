// Chromium for browser tests: the Debian binary, headless, with the flags that keep it quiet and
// offline (never a downloaded browser).
import { chromium, type Browser } from 'playwright-core'

export const CHROMIUM_ARGS = ['--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run',
  '--disable-background-networking', '--disable-component-update', '--disable-sync']

export function launchChromium(): Promise<Browser> {
  return chromium.launch({ executablePath: '/usr/bin/chromium', headless: true, args: CHROMIUM_ARGS })
}
