// Dragging on the chart in Chromium with real mouse events: the demo board's shunt capacitor moves
// its point along the constant-conductance circle, the value changes, a release is one undo step,
// a drag the wrong way is held with a message, and the wheel zooms about the pointer.
// Handles are found through the chart's test hook `window.__gammaboardChart` (ChartStage.vue).
import { afterAll, afterEach, beforeAll, beforeEach, describe, expect, inject, it } from 'vitest'
import { chromium, type Browser, type Page } from 'playwright-core'
import { mkdirSync } from 'node:fs'
import { DEMO_USERS, signInPage } from '../support/auth'

const baseUrl = inject('baseUrl')
const ARTIFACTS = 'tests/artifacts'
const Z0 = 50
let browser: Browser
let page: Page

interface Point { x: number, y: number }
interface Gamma { re: number, im: number }

async function handle(id: string): Promise<Point> {
  const handles = await page.evaluate(() => (window as unknown as { __gammaboardChart: { handles: () => { id: string, x: number, y: number }[] } }).__gammaboardChart.handles())
  const h = handles.find(x => x.id === id)
  if (!h) throw new Error(`no handle for ${id}: ${JSON.stringify(handles)}`)
  return h
}
async function view(): Promise<{ originX: number, originY: number, scalePx: number, zoom: number }> {
  return page.evaluate(() => (window as unknown as { __gammaboardChart: { view: () => { originX: number, originY: number, scalePx: number, zoom: number } } }).__gammaboardChart.view())
}
async function tileValue(id: string): Promise<string> {
  return page.locator(`[data-element-id="${id}"] [data-testid="tile-value"]`).inputValue()
}
async function endpointGamma(): Promise<Gamma> {
  const el = page.locator('[data-testid="endpoint"]')
  return { re: Number(await el.getAttribute('data-gamma-re')), im: Number(await el.getAttribute('data-gamma-im')) }
}
/** Normalised conductance g = Re(Z0/z) of a point given as Γ: (1 − |Γ|²)/|1 + Γ|². */
function conductanceOf(g: Gamma): number {
  return (1 - g.re * g.re - g.im * g.im) / ((1 + g.re) ** 2 + g.im ** 2)
}
function gap(a: Gamma, b: Gamma): number {
  return Math.hypot(a.re - b.re, a.im - b.im)
}

async function openDemoBoard() {
  await page.goto(`${baseUrl}/boards/brackwater-915-antenna`)
  await page.locator('[data-testid="chart"] canvas').first().waitFor()
  await page.waitForFunction(() => {
    const hook = (window as unknown as { __gammaboardChart?: { handles: () => unknown[] } }).__gammaboardChart
    return !!hook && hook.handles().length > 0
  })
}

/** Press on `from`, move in steps to `to` (real mouse events), optionally release. */
async function dragMouse(from: Point, to: Point, steps = 12, release = true) {
  await page.mouse.move(from.x, from.y)
  await page.mouse.down()
  await page.mouse.move(to.x, to.y, { steps })
  // Let the last coalesced frame run before releasing.
  await page.evaluate(() => new Promise(r => requestAnimationFrame(() => r(null))))
  if (release) await page.mouse.up()
}

beforeAll(async () => {
  mkdirSync(ARTIFACTS, { recursive: true })
  browser = await chromium.launch({
    executablePath: '/usr/bin/chromium',
    headless: true,
    args: ['--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking',
      '--disable-component-update', '--disable-sync'],
  })
})
afterAll(async () => { await browser?.close() })

// Each test closes its page, so it does not linger on the board as a colleague's pointer.
afterEach(async () => { await page?.context().close() })

beforeEach(async () => {
  const context = await browser.newContext({ viewport: { width: 1440, height: 900 } })
  page = await context.newPage()
  await signInPage(page, baseUrl, DEMO_USERS.designer.email, DEMO_USERS.designer.password)
})

describe('dragging on the chart', () => {
  it('drags the shunt capacitor along its constant-conductance circle; Ctrl+Z restores it', async () => {
    await openDemoBoard()
    await page.screenshot({ path: `${ARTIFACTS}/chart-before-drag.png` })
    const valueBefore = await tileValue('ant-c1')
    const gammaBefore = await endpointGamma()
    const gBefore = conductanceOf(gammaBefore)

    // More shunt capacitance turns the point clockwise along constant g: down and to the left here.
    const start = await handle('ant-c1')
    await dragMouse(start, { x: start.x - 40, y: start.y + 70 }, 14, false)
    await page.screenshot({ path: `${ARTIFACTS}/chart-during-drag.png` })
    expect(await page.locator('[data-testid="cursor-readout"]').textContent()).toMatch(/VSWR/)
    await page.mouse.up()

    await expect.poll(() => tileValue('ant-c1')).not.toBe(valueBefore)
    const gammaAfter = await endpointGamma()
    expect(gap(gammaAfter, gammaBefore)).toBeGreaterThan(0.05)
    expect(Math.abs(conductanceOf(gammaAfter) - gBefore)).toBeLessThan(1e-6)
    // The handle sits on the new end point.
    const moved = await handle('ant-c1')
    expect(Math.hypot(moved.x - start.x, moved.y - start.y)).toBeGreaterThan(20)
    await page.screenshot({ path: `${ARTIFACTS}/chart-after-drag.png` })

    await page.keyboard.press('Control+z')
    await expect.poll(() => tileValue('ant-c1')).toBe(valueBefore)
    expect(gap(await endpointGamma(), gammaBefore)).toBeLessThan(1e-9)
  })

  it('holds a capacitor dragged the wrong way, says why, and Escape drops the drag', async () => {
    await openDemoBoard()
    const valueBefore = await tileValue('ant-c1')
    const gammaBefore = await endpointGamma()
    // The series L's end is where the C starts (C → 0); beyond it the C would need to be negative.
    const lEnd = await handle('ant-l1')
    const cEnd = await handle('ant-c1')
    const beyond = { x: lEnd.x + (lEnd.x - cEnd.x) * 0.6, y: lEnd.y + (lEnd.y - cEnd.y) * 0.6 }
    await dragMouse(cEnd, beyond, 16, false)
    const message = page.locator('[data-testid="drag-block"]')
    await message.waitFor()
    expect(await message.textContent()).toMatch(/shunt capacitor can only add positive susceptance/)
    await page.screenshot({ path: `${ARTIFACTS}/chart-sign-block.png` })
    await page.keyboard.press('Escape')
    await page.mouse.up()
    await expect.poll(() => message.count()).toBe(0)
    expect(await tileValue('ant-c1')).toBe(valueBefore)
    expect(gap(await endpointGamma(), gammaBefore)).toBeLessThan(1e-12)
    expect(await page.locator('[data-testid="undo"]').isDisabled()).toBe(true)
  })

  it('zooms with the wheel about the pointer, pans by dragging the background, and fits again', async () => {
    await openDemoBoard()
    const chart = page.locator('[data-testid="chart"]')
    const box = (await chart.boundingBox())!
    const fitted = await view()
    expect(fitted.zoom).toBeCloseTo(1, 9)
    const at = { x: Math.round(box.x + box.width * 0.55), y: Math.round(box.y + box.height * 0.45) }
    const gammaUnder = { re: (at.x - box.x - fitted.originX) / fitted.scalePx, im: (fitted.originY - (at.y - box.y)) / fitted.scalePx }
    await page.mouse.move(at.x, at.y)
    await page.mouse.wheel(0, -400)
    await expect.poll(async () => (await view()).zoom).toBeGreaterThan(1.3)
    const zoomed = await view()
    const stillUnder = { re: (at.x - box.x - zoomed.originX) / zoomed.scalePx, im: (zoomed.originY - (at.y - box.y)) / zoomed.scalePx }
    expect(gap(stillUnder, gammaUnder)).toBeLessThan(1e-6)
    expect(Number(await chart.getAttribute('data-zoom'))).toBeGreaterThan(1.3)
    await page.screenshot({ path: `${ARTIFACTS}/chart-zoomed.png` })

    // A background drag far from any handle pans.
    const empty = { x: box.x + box.width - 40, y: box.y + box.height - 40 }
    await dragMouse(empty, { x: empty.x - 120, y: empty.y - 60 }, 8)
    await expect.poll(async () => (await view()).originX).toBeCloseTo(zoomed.originX - 120, 6)
    expect((await view()).originY).toBeCloseTo(zoomed.originY - 60, 6)
    await page.screenshot({ path: `${ARTIFACTS}/chart-panned.png` })

    await page.locator('[data-testid="chart-fit"]').click()
    await expect.poll(async () => (await view()).zoom).toBeCloseTo(1, 9)
  })

  it('toggles the admittance grid and constant-Q arcs from the toolbar', async () => {
    await openDemoBoard()
    await page.locator('[data-testid="toggle-admittance-grid"]').check()
    await page.locator('[data-testid="toggle-q-arcs"]').check()
    await page.locator('[data-testid="q-arc-value"]').fill('1')
    await page.locator('[data-testid="q-arc-value"]').press('Enter')
    await page.mouse.move(10, 10)
    await page.waitForTimeout(150)
    await page.screenshot({ path: `${ARTIFACTS}/chart-both-grids-q.png` })
    // The grid layer's canvas differs from the impedance-only one.
    const withBoth = await page.locator('[data-testid="chart"] canvas').first().screenshot()
    await page.locator('[data-testid="toggle-admittance-grid"]').uncheck()
    await page.waitForTimeout(150)
    const impedanceOnly = await page.locator('[data-testid="chart"] canvas').first().screenshot()
    expect(withBoth.equals(impedanceOnly)).toBe(false)
  })
})
