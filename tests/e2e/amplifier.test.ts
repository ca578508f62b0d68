// An amplifier board in Chromium: place the invented transistor file as the device, read its
// figures, solve the input side to Γopt and read the noise figure come down to near NFmin
// (tests/fixtures/amplifier/invented-phemt.s2p: NFmin 0.318 dB at 1 GHz, its own noise row).
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import type { Browser } from 'playwright-core'
import { mkdirSync, readFileSync } from 'node:fs'
import { fileURLToPath } from 'node:url'
import { DEMO_USERS, signIn, signInPage } from '../support/auth'
import { launchChromium } from '../support/browser'
import { noiseFigureDb, parseTouchstone } from '../../shared/rf/index'

const baseUrl = inject('baseUrl')
const ARTIFACTS = 'tests/artifacts'
const DEVICE = fileURLToPath(new URL('../fixtures/amplifier/invented-phemt.s2p', import.meta.url))
let browser: Browser
let cookie = ''

beforeAll(async () => {
  mkdirSync(ARTIFACTS, { recursive: true })
  cookie = await signIn(baseUrl, DEMO_USERS.designer.email, DEMO_USERS.designer.password)
  browser = await launchChromium()
})
afterAll(async () => { await browser?.close() })

const db = (text: string | null) => Number.parseFloat((text ?? '').replace('−', '-'))

describe('an amplifier board', () => {
  it('takes a device .s2p, shows K and the noise figure, and solving the input to Γopt brings NF to near NFmin', async () => {
    const res = await fetch(`${baseUrl}/api/boards`, {
      method: 'POST', headers: { 'content-type': 'application/json', cookie, origin: baseUrl },
      body: JSON.stringify({ workspace: 'brackwater', name: `Amplifier ${Date.now()}` }),
    })
    expect(res.status).toBe(201)
    const { id } = await res.json()
    const context = await browser.newContext({ viewport: { width: 1440, height: 900 } })
    const page = await context.newPage()
    await signInPage(page, baseUrl, DEMO_USERS.designer.email, DEMO_USERS.designer.password)
    await page.goto(`${baseUrl}/boards/${id}`)
    await page.locator('[data-testid="board"][data-read-only="false"]').waitFor()
    const chooser = page.waitForEvent('filechooser')
    await page.locator('[data-testid="amplifier-pick"]:not([disabled])').click()
    await (await chooser).setFiles(DEVICE)
    await page.locator('[data-testid="amplifier-figures"]').waitFor()
    expect(await page.locator('[data-testid="amplifier-device"]').textContent()).toBe('invented-phemt.s2p')
    expect(await page.locator('[data-testid="amplifier-stability"]').textContent()).toContain('conditionally stable')
    // Empty sides: the device sees 50 Ω, so NF is the noise row's figure at ΓS = 0.
    const row = parseTouchstone(readFileSync(DEVICE, 'utf8'), 'invented-phemt.s2p').noise[1]!
    const before = db(await page.locator('[data-testid="amplifier-nf"]').textContent())
    expect(before).toBeCloseTo(noiseFigureDb(row, { re: 0, im: 0 }), 1)
    await page.locator('[data-testid="amplifier-solve-inputSide"]', { hasText: 'Γopt' }).click()
    await page.locator('[data-testid="amplifier-inputSide"] li input').first().waitFor()
    await expect.poll(async () => db(await page.locator('[data-testid="amplifier-nf"]').textContent())).toBeLessThan(before)
    const after = db(await page.locator('[data-testid="amplifier-nf"]').textContent())
    // The board's default part Q makes the network a little lossy, so ΓS lands near, not on, Γopt.
    expect(after).toBeGreaterThanOrEqual(row.nfminDb - 0.005)
    expect(after).toBeLessThan(row.nfminDb + 0.15)
    await page.locator('[data-testid="amplifier-panel"]').screenshot({ path: `${ARTIFACTS}/amplifier-panel.png` })
    await context.close()
  })
})
