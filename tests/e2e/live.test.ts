// Two Chromium pages on one board over the built server: a typed edit and a chart drag in one show in the other,
// presence avatars show who is there, and a reviewer's page says it is read-only.
import { describe, expect, inject, it } from 'vitest'
import type { Page } from 'playwright-core'
import { ARTIFACTS, useChromium } from '../support/browser'
import { DEMO_USERS, signIn, signInPage } from '../support/auth'
import { connectLive, waitUntil, whenSynced } from '../support/live-client'
import { addElement } from '../../shared/board/ops'
import { readBoard } from '../../shared/board/ydoc'
import { createBoard } from '../live/helpers'

const baseUrl = inject('baseUrl')

const browser = useChromium()

async function pageAs(user: { email: string, password: string }, boardId: string): Promise<Page> {
  const context = await browser().newContext({ viewport: { width: 1440, height: 900 } })
  const page = await context.newPage()
  await signInPage(page, baseUrl, user.email, user.password)
  await page.goto(`${baseUrl}/boards/${boardId}`)
  await page.locator('[data-testid="ladder-tile"]').first().waitFor()
  return page
}

describe('live co-editing in the browser', () => {
  it('shows an edit made in one page in the other, with presence and a read-only reviewer', async () => {
    const cookie = await signIn(baseUrl, DEMO_USERS.designer.email, DEMO_USERS.designer.password)
    const boardId = await createBoard(baseUrl, cookie, 'Browser live test')
    const seeder = connectLive(baseUrl, boardId, { cookie })
    await whenSynced(seeder)
    const id = addElement(seeder.doc, { kind: 'L', placement: 'series', value: 10e-9 })

    const tomas = await pageAs(DEMO_USERS.designer, boardId)
    const mara = await pageAs(DEMO_USERS.admin, boardId)
    seeder.destroy()
    const tile = (page: Page) => page.locator(`[data-element-id="${id}"] [data-testid="tile-value"]`)
    await expect.poll(() => tile(mara).inputValue()).toBe('10 nH')

    await expect.poll(() => mara.locator('[data-testid="presence-avatar"]').evaluateAll(els => els.map(e => e.getAttribute('title') ?? '')))
      .toEqual([expect.stringContaining(DEMO_USERS.designer.name)])

    await tile(tomas).fill('12n')
    await tile(tomas).press('Enter')
    const sentAt = Date.now()
    await expect.poll(() => tile(mara).inputValue(), { timeout: 5000 }).toBe('12 nH')
    expect(Date.now() - sentAt).toBeLessThan(2000)

    // A drag on Tomas's chart: Mara sees him dragging (the draft, through presence) and then the value.
    const handle = await tomas.evaluate(elementId => (window as unknown as { __gammaboardChart: { handles: () => { id: string, x: number, y: number }[] } })
      .__gammaboardChart.handles().find(h => h.id === elementId), id)
    expect(handle).toBeTruthy()
    await tomas.mouse.move(handle!.x, handle!.y)
    await tomas.mouse.down()
    for (let step = 1; step <= 8; step++) await tomas.mouse.move(handle!.x + step * 2, handle!.y - step * 6)
    await expect.poll(() => mara.locator('[data-testid="presence-avatar"]').first().getAttribute('title'), { timeout: 5000 })
      .toContain('dragging')
    await tomas.mouse.up()
    await expect.poll(() => tile(mara).inputValue(), { timeout: 5000 }).not.toBe('12 nH')
    const dragged = await tile(tomas).inputValue()
    await expect.poll(() => tile(mara).inputValue()).toBe(dragged)
    await expect.poll(() => mara.locator('[data-testid="presence-avatar"]').first().getAttribute('title')).not.toContain('dragging')

    const ines = await pageAs(DEMO_USERS.reviewer, boardId)
    await ines.locator('[data-testid="read-only-banner"]').waitFor()
    expect(await tile(ines).inputValue()).toBe(dragged)
    await expect.poll(() => tomas.locator('[data-testid="presence-avatar"]').count()).toBe(2)
    await mara.screenshot({ path: `${ARTIFACTS}/live-two-pages.png` })
    await ines.screenshot({ path: `${ARTIFACTS}/live-reviewer.png` })

    // The edit reached the server's document too (a fresh client sees it).
    const check = connectLive(baseUrl, boardId, { cookie })
    await whenSynced(check)
    await waitUntil(() => {
      const value = (readBoard(check.doc).elements[0] as { value?: number } | undefined)?.value
      return value !== undefined && value !== 10e-9 && value !== 12e-9
    })
    check.destroy()
  })
})
