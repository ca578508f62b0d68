// The printed report uses the board's own source power and default Q (not a fixed 1 W), and prints
// the parts beyond their ratings beside the cautions. The board is set up over the live socket from
// Node, then the report is opened in Chromium.
import Complex from 'complex.js'
import { afterAll, describe, expect, inject, it } from 'vitest'
import { addElement, updateSettings } from '../../shared/board/ops'
import { ARTIFACTS, useChromium } from '../support/browser'
import { DEMO_USERS, signIn, signInPage } from '../support/auth'
import { connectLive, whenSynced, type LiveClient } from '../support/live-client'
import { createBoard } from '../live/helpers'

const baseUrl = inject('baseUrl')
let client: LiveClient | undefined

const browser = useChromium()
afterAll(() => { client?.destroy() })

// The case: 50 Ω source and load at 915 MHz with one shunt 1 pF capacitor across the load.
const FREQUENCY_HZ = 915e6
const C_FARADS = 1e-12
const POWER_W = 5
const Z0 = 50

/**
 * Hand check, independent of the app's stress code: a source of EMF √(4·Z0·P) (P available) and
 * internal Z0 drives the load in parallel with the capacitor (its ESR = Xc/Q in series, Q = 200 from
 * the board's default): the RMS voltage across the capacitor is the voltage divider's output.
 */
function expectedCapVoltsRms(q: number): number {
  const xc = 1 / (2 * Math.PI * FREQUENCY_HZ * C_FARADS)
  const branch = new Complex(xc / q, -xc)
  const node = branch.mul(Z0).div(branch.add(Z0))
  const emf = Math.sqrt(4 * Z0 * POWER_W)
  return node.div(node.add(Z0)).abs() * emf
}

describe('the printed report follows the board settings', () => {
  it('prints the board power, its default Q, the stress at that power and the flagged part', async () => {
    const cookie = await signIn(baseUrl, DEMO_USERS.designer.email, DEMO_USERS.designer.password)
    const boardId = await createBoard(baseUrl, cookie, 'Report settings check')
    client = connectLive(baseUrl, boardId, { cookie })
    await whenSynced(client)
    updateSettings(client.doc, {
      frequencyHz: FREQUENCY_HZ, bandStartHz: 900e6, bandStopHz: 930e6,
      spec: { minReturnLossDb: 10, f1Hz: 902e6, f2Hz: 928e6 },
      load: { kind: 'impedance', z: { re: Z0, im: 0 } }, sourcePowerW: POWER_W,
    })
    // Rated 10 V: below the ≈ 15.7 V it sees at 5 W, so it must be flagged (at 1 W, ≈ 7 V, it would not).
    addElement(client.doc, { kind: 'C', placement: 'shunt', value: C_FARADS, vRatingV: 10 })

    const page = await (await browser().newContext({ viewport: { width: 1100, height: 1400 } })).newPage()
    await signInPage(page, baseUrl, DEMO_USERS.designer.email, DEMO_USERS.designer.password)
    await page.goto(`${baseUrl}/boards/${boardId}/report`)
    const ladder = page.locator('[data-testid="report-ladder"]')
    await expect.poll(() => ladder.innerText(), { timeout: 10_000 }).toMatch(/for 5 W \(37(\.0+)? dBm\)/)
    // New blank boards carry the typical default Q; the report says which Q the figures assume.
    expect(await ladder.innerText()).toMatch(/default Q L 40 \/ C 200/)

    // The cell reads "RMS V / peak V": the RMS against the hand divider, the peak √2 times it (a sine).
    const [volts, peak] = ((await page.locator('[data-testid="report-part"] td').nth(4).innerText()).match(/\d+(\.\d+)?/g) ?? []).map(Number)
    expect(Math.abs(volts - expectedCapVoltsRms(200)) / expectedCapVoltsRms(200)).toBeLessThan(0.01)
    expect(Math.abs(peak - Math.SQRT2 * volts) / (Math.SQRT2 * volts)).toBeLessThan(0.01)

    const warning = page.locator('[data-testid="report-over-rating"]')
    await warning.waitFor()
    expect(await warning.innerText()).toMatch(/shunt C/i)
    expect(await page.locator('[data-testid="report-cautions"] [data-testid="cautions-note"]').count()).toBe(1)
    await page.screenshot({ path: `${ARTIFACTS}/report-settings.png`, fullPage: true })
  })
})
