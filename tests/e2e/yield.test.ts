// Real parts in Chromium: the Monte Carlo worker's progress and cancel on a demo board, the cloud
// on the chart, and a part flagged beyond its rating at the source power. Screenshots land in
// tests/artifacts/ for a person to look at.
import { beforeAll, beforeEach, describe, expect, inject, it } from 'vitest'
import type { Page } from 'playwright-core'
import { DEMO_USERS, signIn } from '../support/auth'
import { ARTIFACTS, signedInPage, useChromium } from '../support/browser'
import { demoTemplateId, newDemoBoard } from '../support/demo-boards'

const baseUrl = inject('baseUrl')
const browser = useChromium()
let page: Page
let cookie = ''

type Progress = { status: string, completed: number, total: number }

async function openBoard(id: string) {
  await page.goto(`${baseUrl}/boards/${id}`)
  await page.locator('[data-testid="board"]').waitFor()
  await page.locator('[data-testid="ladder-tile"]').first().waitFor()
  await page.locator('[data-testid="yield-panel"]').waitFor()
}

/** Polls the worker's progress from inside the page until it leaves `running` (or `stopAt` trials pass). */
async function watchProgress(stopAt = Infinity): Promise<Progress[]> {
  return page.evaluate(async (limit) => {
    const hook = (window as any).__gammaboardMonteCarlo
    const seen: Progress[] = []
    const deadline = performance.now() + 60_000
    for (;;) {
      const p = hook.progress() as Progress
      if (!seen.length || seen[seen.length - 1]!.completed !== p.completed || seen[seen.length - 1]!.status !== p.status) seen.push(p)
      if (p.status !== 'running' || p.completed >= limit || performance.now() > deadline) return seen
      await new Promise(r => setTimeout(r, 10))
    }
  }, stopAt)
}

async function setTrials(n: number) {
  const field = page.locator('[data-testid="yield-trials"]')
  await field.fill(String(n))
  await field.dispatchEvent('change')
}

beforeAll(async () => {
  cookie = await signIn(baseUrl, DEMO_USERS.designer.email, DEMO_USERS.designer.password)
})
beforeEach(async () => {
  page = await signedInPage(browser(), baseUrl, DEMO_USERS.designer, { width: 1440, height: 1000 })
})

describe('tolerance yield in the browser', () => {
  it('runs in the worker with rising progress, then shows the yield, the histogram and the cloud', async () => {
    await openBoard('brackwater-915-antenna')
    await setTrials(200000)
    await page.locator('[data-testid="yield-run"]').click()
    const seen = await watchProgress()
    const running = seen.filter(p => p.status === 'running' && p.completed > 0 && p.completed < p.total)
    // Progress came in several steps, each larger than the last, before the run finished.
    expect(running.length).toBeGreaterThanOrEqual(2)
    for (let i = 1; i < running.length; i++) expect(running[i]!.completed).toBeGreaterThan(running[i - 1]!.completed)
    expect(seen[seen.length - 1]).toEqual({ status: 'done', completed: 200000, total: 200000 })
    const yieldText = await page.locator('[data-testid="yield-value"]').textContent()
    const value = Number(yieldText!.replace('%', '').trim())
    expect(value).toBeGreaterThanOrEqual(0)
    expect(value).toBeLessThanOrEqual(100)
    await page.locator('[data-testid="yield-histogram"] canvas').first().waitFor()
    // The cloud is in the board store for the chart: 400 end points, finite impedances with R > 0.
    const cloud = await page.evaluate(() => (window as any).__gammaboardMonteCarlo.cloud()) as { re: number, im: number }[]
    expect(cloud).toHaveLength(400)
    expect(cloud.every(z => Number.isFinite(z.re) && Number.isFinite(z.im) && z.re > 0)).toBe(true)
    expect(new Set(cloud.map(z => z.re)).size).toBeGreaterThan(300)
    await page.locator('[data-testid="yield-panel"]').scrollIntoViewIfNeeded()
    await page.screenshot({ path: `${ARTIFACTS}/yield-done.png` })
  })

  it('cancels a long run within a slice and keeps the board usable', async () => {
    await openBoard('brackwater-915-antenna')
    await setTrials(1000000)
    await page.locator('[data-testid="yield-run"]').click()
    const before = await watchProgress(1)
    expect(before[before.length - 1]!.status).toBe('running')
    await page.locator('[data-testid="yield-cancel"]').click()
    const after = await watchProgress()
    const last = after[after.length - 1]!
    expect(last.status).toBe('cancelled')
    expect(last.completed).toBeGreaterThan(0)
    expect(last.completed).toBeLessThan(1000000)
    // Nothing moves after a cancel.
    await page.waitForTimeout(300)
    const still = await page.evaluate(() => (window as any).__gammaboardMonteCarlo.progress())
    expect(still).toEqual(last)
    await expect(page.locator('[data-testid="yield-progress-text"]').textContent()).resolves.toContain('cancelled')
    await page.locator('[data-testid="yield-run"]').waitFor()
    await page.locator('[data-testid="yield-panel"]').scrollIntoViewIfNeeded()
    await page.screenshot({ path: `${ARTIFACTS}/yield-cancelled.png` })
  })
})

describe('stress at the source power in the browser', () => {
  it('flags a capacitor beyond its voltage rating in the parts list and on its tile', async () => {
    await openBoard(await newDemoBoard(baseUrl, cookie, 'Stress browser test', await demoTemplateId(baseUrl, cookie)))
    await page.locator('[data-testid="board"][data-read-only="false"]').waitFor()
    const power = page.locator('[data-testid="source-power"]')
    await power.fill('30 dBm')
    await power.press('Enter')
    await expect.poll(() => page.locator('[data-testid="part-v-ant-c1"]').textContent()).toMatch(/V/)
    // The cell reads "RMS V / peak V": take the RMS figure.
    const volts = Number((await page.locator('[data-testid="part-v-ant-c1"]').textContent())!.match(/\d+(\.\d+)?/)?.[0])
    // 1 W available into a near-match on 50 Ω: about √50 ≈ 7 V across the shunt C.
    expect(volts).toBeGreaterThan(3)
    expect(volts).toBeLessThan(15)
    expect(await page.locator('[data-testid="tile-over-rating"]').count()).toBe(0)
    const rating = page.locator('[data-testid="vrating-ant-c1"]')
    await rating.fill('2 V')
    await rating.press('Enter')
    await page.locator('[data-element-id="ant-c1"] [data-testid="tile-over-rating"]').waitFor()
    expect(await page.locator('[data-testid="part-v-ant-c1"]').getAttribute('data-over')).toBe('true')
    expect(await page.locator('[data-testid="part-i-ant-l1"]').getAttribute('data-over')).toBe('false')
    await page.locator('[data-testid="cautions-note"]').waitFor()
    await page.locator('[data-testid="stress-panel"]').scrollIntoViewIfNeeded()
    await page.screenshot({ path: `${ARTIFACTS}/stress-flagged.png` })

    // The printed report shows the same power, the same figure and the same flag.
    const boardVolts = (await page.locator('[data-testid="part-v-ant-c1"]').textContent())!
    await page.locator('[data-testid="open-report"]').click()
    await page.locator('[data-testid="report-over-rating"]').waitFor()
    expect(await page.locator('[data-testid="report-over-rating"]').innerText()).toMatch(/shunt C/i)
    const ladderText = await page.locator('[data-testid="report-ladder"]').innerText()
    expect(ladderText).toMatch(/for 1 W \(30(\.0+)? dBm\)/)
    expect(ladderText).toContain(Number(boardVolts.match(/\d+(\.\d+)?/)?.[0]).toPrecision(3).slice(0, 3))
    await page.screenshot({ path: `${ARTIFACTS}/report-over-rating.png`, fullPage: true })
  })
})
