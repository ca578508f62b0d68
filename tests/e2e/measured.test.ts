// A measured antenna file through the board page in Chromium: the file chooser, the dotted trace
// on the chart, the band plot from the measured points, markers, a refused file with its line,
// and the printable report (screenshots in tests/artifacts/ for a person to look at).
// Reference files: tests/fixtures/reference/touchstone (invented data; errors as in its expected.json).
import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest'
import { REFERENCE_ROOT } from '../support/reference'
import type { Browser, Page } from 'playwright-core'
import { mkdirSync } from 'node:fs'
import path from 'node:path'
import { DEMO_USERS, signIn, signInPage } from '../support/auth'
import { launchChromium } from '../support/browser'
import { demoTemplateId, newDemoBoard } from '../support/demo-boards'

const baseUrl = inject('baseUrl')
const ARTIFACTS = 'tests/artifacts'
const TOUCHSTONE_DIR = path.resolve(REFERENCE_ROOT, 'touchstone')
const MEASURED_RGB = [0x6b, 0x3f, 0xa0] // shared/board/measured-style.ts MEASURED_HUE
let browser: Browser
let cookie = ''

function newBoard(name: string, templateId?: string): Promise<string> {
  return newDemoBoard(baseUrl, cookie, name, templateId)
}

async function openPage(boardId: string): Promise<Page> {
  const context = await browser.newContext({ viewport: { width: 1440, height: 900 } })
  const page = await context.newPage()
  await signInPage(page, baseUrl, DEMO_USERS.designer.email, DEMO_USERS.designer.password)
  await page.goto(`${baseUrl}/boards/${boardId}`)
  await page.locator('[data-testid="board"][data-read-only="false"]').waitFor()
  await page.locator('[data-testid="measured-pick"]:not([disabled])').waitFor()
  return page
}

async function chooseFile(page: Page, file: string) {
  const chooser = page.waitForEvent('filechooser')
  await page.locator('[data-testid="measured-pick"]').click()
  await (await chooser).setFiles(path.join(TOUCHSTONE_DIR, file))
}

/** Pixels of the measured hue on the chart's canvases. */
function measuredPixels(page: Page): Promise<number> {
  return page.evaluate((rgb) => {
    let count = 0
    for (const canvas of document.querySelectorAll<HTMLCanvasElement>('[data-testid="chart"] canvas')) {
      const data = canvas.getContext('2d')!.getImageData(0, 0, canvas.width, canvas.height).data
      for (let i = 0; i < data.length; i += 4) {
        if (data[i + 3]! > 200 && Math.abs(data[i]! - rgb[0]!) < 12 && Math.abs(data[i + 1]! - rgb[1]!) < 12 && Math.abs(data[i + 2]! - rgb[2]!) < 12) count++
      }
    }
    return count
  }, MEASURED_RGB)
}

beforeAll(async () => {
  mkdirSync(ARTIFACTS, { recursive: true })
  cookie = await signIn(baseUrl, DEMO_USERS.designer.email, DEMO_USERS.designer.password)
  browser = await launchChromium()
})
afterAll(async () => { await browser?.close() })

describe('a measured antenna on the board', () => {
  it('takes a .s1p from the file chooser as the load, draws it, plots the band, places markers and prints a report', async () => {
    const templateId = await demoTemplateId(baseUrl, cookie)
    const boardId = await newBoard('Measured antenna (browser test)', templateId)
    const page = await openPage(boardId)
    const worstBefore = await page.locator('[data-testid="band-worst-all"]').innerText()
    expect(await measuredPixels(page)).toBe(0)

    await chooseFile(page, 'antenna_ri_mhz.s1p')
    await page.locator('[data-testid="measured-load"]').waitFor()
    expect(await page.locator('[data-testid="measured-load"]').innerText()).toMatch(/antenna_ri_mhz\.s1p, 21 points, 800 MHz–1 GHz/)
    // The template's band (880–950 MHz) lies inside the file: nothing to flag.
    expect(await page.locator('[data-testid="measured-range-flag"]').count()).toBe(0)
    await expect.poll(() => measuredPixels(page), { timeout: 5000 }).toBeGreaterThan(40)
    await expect.poll(() => page.locator('[data-testid="band-worst-all"]').innerText()).not.toBe(worstBefore)

    // A marker from a click in the middle of the band plot.
    const plot = page.locator('[data-testid="band-plot"] .u-over')
    const box = (await plot.boundingBox())!
    await page.mouse.click(box.x + box.width / 2, box.y + box.height / 2)
    await page.locator('[data-testid="marker-row"]').first().waitFor()
    expect(await page.locator('[data-testid="marker-row"]').first().innerText()).toMatch(/M1\s+9\d\d(\.\d+)? MHz/)
    await page.screenshot({ path: `${ARTIFACTS}/measured-board.png` })

    // A refused file names its line and reason (non_numeric.s1p: line 4, token 'abc').
    await chooseFile(page, 'non_numeric.s1p')
    const problem = page.locator('[data-testid="measured-problem"]')
    await problem.waitFor()
    expect(await problem.innerText()).toMatch(/non_numeric\.s1p was not taken, line 4[\s\S]*token 'abc' is not a number/)
    // The good load stays.
    expect(await page.locator('[data-testid="measured-load"]').innerText()).toMatch(/antenna_ri_mhz/)

    await page.locator('[data-testid="open-report"]').click()
    await page.locator('[data-testid="report-inputs"]').waitFor()
    await expect.poll(() => page.locator('[data-testid="report-load"]').innerText()).toMatch(/measured: antenna_ri_mhz\.s1p/)
    expect(await page.locator('[data-testid="report-part"]').count()).toBe(2)
    await page.locator('[data-testid="report-chart"] canvas').first().waitFor()
    await page.waitForTimeout(1200)
    await page.screenshot({ path: `${ARTIFACTS}/report.png`, fullPage: true })
    await page.emulateMedia({ media: 'print' })
    await page.screenshot({ path: `${ARTIFACTS}/report-print.png`, fullPage: true })
    expect(await page.locator('[data-testid="report-chart"] img').count()).toBe(1)
    await page.context().close()
  })

  it('flags a band that runs past the measured data', async () => {
    // A new board's band is 0.9–1.1 GHz; the file stops at 1 GHz.
    const page = await openPage(await newBoard('Measured band edge (browser test)'))
    await chooseFile(page, 'antenna_ma_ghz.s1p')
    const flag = page.locator('[data-testid="measured-range-flag"]')
    await flag.waitFor()
    expect(await flag.innerText()).toMatch(/800 MHz–1 GHz\): 50 of 101 band points are left out, not extrapolated/)
    await page.context().close()
  })
})
