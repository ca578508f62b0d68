// The ladder hunt (match search) in Chromium: the Web Worker's progress and cancel, a finished
// run's candidates and Fano's limit, the dashed preview on hover, "Use" replacing the ladder with
// the band plot agreeing with the candidate's figure, and a reviewer who may run but not use.
// Screenshots land in tests/artifacts/ for a person to look at.
import { beforeAll, describe, expect, inject, it } from 'vitest'
import type { Page } from 'playwright-core'
import { DEMO_USERS, signIn } from '../support/auth'
import { ARTIFACTS, signedInPage, useChromium } from '../support/browser'
import { demoTemplateId, newDemoBoard } from '../support/demo-boards'

const baseUrl = inject('baseUrl')
const browser = useChromium()
let cookie = ''
let templateId = ''

function freshAntennaBoard(): Promise<string> {
  return newDemoBoard(baseUrl, cookie, 'Hunt browser board', templateId)
}

async function openBoard(page: Page, id: string, readOnly = false) {
  await page.goto(`${baseUrl}/boards/${id}`)
  await page.locator(`[data-testid="board"][data-read-only="${readOnly}"]`).waitFor()
  await page.locator('[data-testid="hunt-panel"]').waitFor()
}

/** Polls the progress bar from inside the page until it goes away (or `stopAt` percent is reached). */
async function watchProgress(page: Page, stopAt = 101): Promise<number[]> {
  return page.evaluate(async (limit) => {
    const seen: number[] = []
    const deadline = performance.now() + 60_000
    for (;;) {
      const bar = document.querySelector('[data-testid="hunt-progress"]')
      if (!bar) return seen
      const v = Number(bar.getAttribute('aria-valuenow'))
      if (seen[seen.length - 1] !== v) seen.push(v)
      if (v >= limit || performance.now() > deadline) return seen
      await new Promise(r => setTimeout(r, 5))
    }
  }, stopAt)
}

async function choose(page: Page, series: string, size: number) {
  await page.locator('[data-testid="hunt-series"]').selectOption(series)
  await page.locator('[data-testid="hunt-size"]').selectOption(String(size))
}

beforeAll(async () => {
  cookie = await signIn(baseUrl, DEMO_USERS.designer.email, DEMO_USERS.designer.password)
  templateId = await demoTemplateId(baseUrl, cookie)
})

describe('ladder hunt in the browser', () => {
  it('shows rising progress and stops on cancel, listing nothing from the stopped run', async () => {
    const page = await signedInPage(browser(), baseUrl, DEMO_USERS.designer, { width: 1440, height: 1000 })
    await openBoard(page, await freshAntennaBoard())
    await choose(page, 'E96', 3)
    await page.locator('[data-testid="hunt-run"]').click()
    const seen = await watchProgress(page, 10)
    expect(seen.length).toBeGreaterThanOrEqual(2)
    for (let i = 1; i < seen.length; i++) expect(seen[i]!).toBeGreaterThan(seen[i - 1]!)
    await page.locator('[data-testid="hunt-panel"]').scrollIntoViewIfNeeded()
    await page.screenshot({ path: `${ARTIFACTS}/hunt-running.png` })
    await page.locator('[data-testid="hunt-cancel"]').click()
    await page.locator('[data-testid="hunt-cancelled"]').waitFor()
    expect(await page.locator('[data-testid="hunt-row"]').count()).toBe(0)
    await expect(page.locator('[data-testid="hunt-run"]').isEnabled()).resolves.toBe(true)
  })

  it('lists candidates with the limit, previews one dashed on hover, and uses it: the band plot agrees', async () => {
    const page = await signedInPage(browser(), baseUrl, DEMO_USERS.designer, { width: 1440, height: 1000 })
    await openBoard(page, await freshAntennaBoard())
    await choose(page, 'E24', 3)
    await page.locator('[data-testid="hunt-run"]').click()
    await page.locator('[data-testid="hunt-row"]').first().waitFor({ timeout: 30_000 })
    const limitText = await page.locator('[data-testid="hunt-limit"]').textContent()
    // A fixed impedance load: the limit is an estimate from the model fitted at band centre.
    expect(limitText).toMatch(/Fano limit .+ dB \((series|parallel)-RC load, estimate/)
    await expect(page.locator('[data-testid="band-fano"]').textContent()).resolves.toMatch(/estimate/)
    const rows = page.locator('[data-testid="hunt-row"]')
    expect(await rows.count()).toBeGreaterThan(3)
    const rl = await rows.locator('[data-testid="hunt-row-rl"]').allTextContents()
    const values = rl.map(t => Number.parseFloat(t))
    for (let i = 1; i < values.length; i++) expect(values[i]!).toBeLessThanOrEqual(values[i - 1]!)
    const best = rows.first()
    const parts = await best.locator('span.tabular-nums').count()
    await best.hover()
    // The board's preview (drawn dashed on the chart) is the candidate's ladder.
    await page.locator(`[data-testid="hunt-panel"][data-preview-parts="${parts}"]`).waitFor()
    await page.screenshot({ path: `${ARTIFACTS}/hunt-results.png` })
    await best.locator('[data-testid="hunt-use"]').click()
    await expect.poll(() => page.locator('[data-testid="ladder-tile"]').count()).toBe(parts)
    await expect.poll(() => page.locator('[data-testid="band-worst"]').textContent()).toBe(rl[0])
    await page.locator('[data-testid="band-plot"]').scrollIntoViewIfNeeded()
    await page.screenshot({ path: `${ARTIFACTS}/hunt-used.png` })
    // One undo step restores the template's two parts.
    await page.locator('body').click({ position: { x: 5, y: 300 } })
    await page.keyboard.press('Control+z')
    await expect.poll(() => page.locator('[data-testid="ladder-tile"]').count()).toBe(2)
  })

  it('lets a reviewer run it but not use a result', async () => {
    const page = await signedInPage(browser(), baseUrl, DEMO_USERS.reviewer, { width: 1440, height: 1000 })
    await openBoard(page, 'brackwater-915-antenna', true)
    await choose(page, 'E12', 2)
    await page.locator('[data-testid="hunt-run"]').click()
    await page.locator('[data-testid="hunt-row"]').first().waitFor({ timeout: 30_000 })
    const uses = page.locator('[data-testid="hunt-use"]')
    expect(await uses.count()).toBeGreaterThan(0)
    for (const b of await uses.all()) expect(await b.isDisabled()).toBe(true)
  })
})
