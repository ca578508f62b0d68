// The board page in Chromium: typed values, ladder edits, undo/redo by keyboard, a solver result.
// Screenshots land in tests/artifacts/ for a person to look at.
import { beforeAll, beforeEach, describe, expect, inject, it } from 'vitest'
import type { Page } from 'playwright-core'
import { DEMO_USERS, signIn } from '../support/auth'
import { ARTIFACTS, signedInPage, useChromium } from '../support/browser'
import { demoTemplateId, newDemoBoard } from '../support/demo-boards'

const baseUrl = inject('baseUrl')
const browser = useChromium()
let page: Page
let cookie = ''
let templateId = ''

/**
 * A new board copied from the demo template (the soil node's antenna match, ant-l1 and ant-c1):
 * boards are live and stored, so each test that edits gets its own.
 */
function freshAntennaBoard(): Promise<string> {
  return newDemoBoard(baseUrl, cookie, 'Browser test board', templateId)
}

async function tileIds(): Promise<string[]> {
  return page.locator('[data-testid="ladder-tile"]').evaluateAll(els => els.map(el => el.getAttribute('data-element-id') ?? ''))
}
async function tileValue(id: string): Promise<string> {
  return page.locator(`[data-element-id="${id}"] [data-testid="tile-value"]`).inputValue()
}
async function endpointGamma(): Promise<{ re: number, im: number }> {
  const el = page.locator('[data-testid="endpoint"]')
  return { re: Number(await el.getAttribute('data-gamma-re')), im: Number(await el.getAttribute('data-gamma-im')) }
}
/** Opens a board and waits until it has synced with the live server and may be edited. */
async function openBoard(id: string) {
  await page.goto(`${baseUrl}/boards/${id}`)
  await page.locator('[data-testid="board"][data-read-only="false"]').waitFor()
  await page.locator('[data-testid="ladder-tile"]').first().waitFor()
}

beforeAll(async () => {
  cookie = await signIn(baseUrl, DEMO_USERS.designer.email, DEMO_USERS.designer.password)
  templateId = await demoTemplateId(baseUrl, cookie)
})

beforeEach(async () => {
  page = await signedInPage(browser(), baseUrl, DEMO_USERS.designer, { width: 1440, height: 900 })
})

describe('the board page', () => {
  it('shows the demo board: tiles from load to source, readout, band plot and parts', async () => {
    await openBoard(await freshAntennaBoard())
    expect(await tileIds()).toEqual(['ant-l1', 'ant-c1'])
    expect(await tileValue('ant-l1')).toBe('10 nH')
    expect(await tileValue('ant-c1')).toBe('3.9 pF')
    await page.locator('[data-testid="band-plot"] canvas').waitFor()
    expect(await page.locator('[data-testid="parts-table"] tbody tr').count()).toBe(2)
    await page.screenshot({ path: `${ARTIFACTS}/board-915.png` })
    // The parts list downloads as CSV: a header and one row per part.
    const [download] = await Promise.all([
      page.waitForEvent('download'),
      page.locator('[data-testid="parts-csv"]').click(),
    ])
    const { readFileSync } = await import('node:fs')
    const csv = readFileSync((await download.path())!, 'utf8').trim().split('\n')
    expect(csv[0]).toMatch(/^position,element,exact,/)
    expect(csv.slice(1).map(line => line.split(',').slice(0, 3).join(','))).toEqual(['1,series L,10 nH', '2,shunt C,3.9 pF'])
  })

  it('refuses a bad typed value with a message and leaves the value unchanged', async () => {
    await openBoard(await freshAntennaBoard())
    const before = await endpointGamma()
    const input = page.locator('[data-element-id="ant-c1"] [data-testid="tile-value"]')
    await input.fill('4.7q')
    await input.press('Enter')
    const message = page.locator('[data-element-id="ant-c1"] [data-testid="tile-value-message"]')
    await message.waitFor()
    expect(await message.textContent()).toMatch(/unknown prefix or unit/)
    expect(await endpointGamma()).toEqual(before)
    expect(await page.locator('[data-testid="undo"]').isDisabled()).toBe(true)
    await page.screenshot({ path: `${ARTIFACTS}/board-bad-value.png` })
    // A good value then goes through, and the message goes away.
    await input.fill('4.7p')
    await input.press('Enter')
    await expect.poll(() => tileValue('ant-c1')).toBe('4.7 pF')
    expect(await message.count()).toBe(0)
    expect(await endpointGamma()).not.toEqual(before)
  })

  it('adds by palette and by key, reorders by dragging, deletes, and undoes and redoes by keyboard', async () => {
    await openBoard(await freshAntennaBoard())
    await page.locator('[data-testid="palette-toggle"]').click()
    await page.locator('[data-testid="palette-series-C"]').click()
    await page.locator('[data-testid="palette-toggle"]').click()
    await page.locator('body').click({ position: { x: 5, y: 300 } })
    await page.keyboard.press('Shift+L')
    const ids = await tileIds()
    expect(ids).toHaveLength(4)
    expect(await page.locator('[data-testid="ladder-tile"]').evaluateAll(els => els.map(el => el.getAttribute('data-kind'))))
      .toEqual(['L', 'C', 'C', 'L'])
    await page.screenshot({ path: `${ARTIFACTS}/board-four-tiles.png` })

    // Drag the last tile by its grip onto the first.
    const grip = page.locator(`[data-element-id="${ids[3]}"] [data-drag-handle]`)
    const target = page.locator(`[data-element-id="${ids[0]}"]`)
    const from = (await grip.boundingBox())!
    const to = (await target.boundingBox())!
    await page.mouse.move(from.x + from.width / 2, from.y + from.height / 2)
    await page.mouse.down()
    for (let i = 1; i <= 12; i++) {
      await page.mouse.move(from.x + (to.x + 10 - from.x) * (i / 12), from.y + from.height / 2)
    }
    await page.mouse.up()
    await expect.poll(tileIds).toEqual([ids[3], ids[0], ids[1], ids[2]])

    // Lock it, then unlock it with the K key.
    const lock = page.locator(`[data-element-id="${ids[3]}"] [data-testid="tile-lock"]`)
    await lock.click()
    await expect.poll(() => page.locator(`[data-element-id="${ids[3]}"]`).getAttribute('data-locked')).toBe('true')
    await page.locator('body').click({ position: { x: 5, y: 300 } })
    await page.locator(`[data-element-id="${ids[3]}"] [data-drag-handle]`).click()
    await page.keyboard.press('k')
    await expect.poll(() => page.locator(`[data-element-id="${ids[3]}"]`).getAttribute('data-locked')).toBe('false')
    await page.keyboard.press('Control+z')
    await page.keyboard.press('Control+z')
    await expect.poll(tileIds).toEqual([ids[3], ids[0], ids[1], ids[2]])
    expect(await page.locator(`[data-element-id="${ids[3]}"]`).getAttribute('data-locked')).toBe('false')

    // Delete the moved tile with its button.
    await page.locator(`[data-element-id="${ids[3]}"] [data-testid="tile-delete"]`).click()
    await expect.poll(tileIds).toEqual([ids[0], ids[1], ids[2]])

    await page.locator('body').click({ position: { x: 5, y: 300 } })
    await page.keyboard.press('Control+z')
    await expect.poll(tileIds).toEqual([ids[3], ids[0], ids[1], ids[2]])
    await page.keyboard.press('Control+z')
    await expect.poll(tileIds).toEqual(ids)
    await page.keyboard.press('Control+Shift+z')
    await expect.poll(tileIds).toEqual([ids[3], ids[0], ids[1], ids[2]])
  })

  it('previews a solver result and uses it as one undo step', async () => {
    await openBoard(await freshAntennaBoard())
    const row = page.locator('[data-testid="solution-row"][data-solution-id^="L-"]').first()
    await row.scrollIntoViewIfNeeded()
    await row.hover()
    await page.screenshot({ path: `${ARTIFACTS}/board-solve-preview.png` })
    await row.locator('[data-testid="solution-use"]').click()
    await expect.poll(async () => Math.hypot(...Object.values(await endpointGamma()))).toBeLessThan(1e-3)
    expect(await page.locator('[data-testid="band-verdict"]').getAttribute('data-pass')).toBe('true')
    await page.locator('body').click({ position: { x: 5, y: 300 } })
    await page.keyboard.press('Control+z')
    await expect.poll(tileIds).toEqual(['ant-l1', 'ant-c1'])
  })

  it('opens the other demo boards, the key list and a terminal editor', async () => {
    await openBoard('brackwater-gateway-2g4')
    expect(await page.locator('[data-testid="board-name"]').textContent()).toContain('2.4 GHz')
    expect((await tileIds()).length).toBeGreaterThan(0)
    await page.locator('body').click({ position: { x: 5, y: 300 } })
    await page.keyboard.press('?')
    await page.locator('[data-testid="board-help"]').waitFor()
    await page.screenshot({ path: `${ARTIFACTS}/board-gateway-help.png` })
    await openBoard('brackwater-868-lna')
    await page.locator('[data-testid="terminal-load"]').click()
    await page.locator('[data-testid="terminal-editor-load"]').waitFor()
    await page.screenshot({ path: `${ARTIFACTS}/board-lna-terminal.png` })
  })

  it('says so when a board does not exist', async () => {
    await page.goto(`${baseUrl}/boards/no-such-board`)
    const message = page.locator('[data-testid="board-load-error"]')
    await message.waitFor()
    expect(await message.textContent()).toMatch(/no board at this address/)
  })
})
