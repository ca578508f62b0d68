// In Chromium: the workspace home's "In it now" column shows an avatar for someone who opens a
// board (a Node live client here), without a reload (the list refreshes about every 10 s), and
// drops it after they leave.
import { afterAll, describe, expect, inject, it } from 'vitest'
import { ARTIFACTS, useChromium } from '../support/browser'
import { DEMO_USERS, signIn, signInPage } from '../support/auth'
import { connectLive, whenSynced, type LiveClient } from '../support/live-client'
import { createBoard } from '../live/helpers'

const baseUrl = inject('baseUrl')
let client: LiveClient | undefined

const browser = useChromium()
afterAll(() => { client?.destroy() })

describe('who is in each board, on the workspace home', () => {
  it('shows a colleague who opens a board, then not after they leave', async () => {
    const designer = await signIn(baseUrl, DEMO_USERS.designer.email, DEMO_USERS.designer.password)
    const boardId = await createBoard(baseUrl, designer, `Presence column ${Date.now()}`)
    const page = await (await browser().newContext({ viewport: { width: 1280, height: 900 } })).newPage()
    await signInPage(page, baseUrl, DEMO_USERS.reviewer.email, DEMO_USERS.reviewer.password)
    await page.goto(`${baseUrl}/w/brackwater`)
    const cell = page.locator(`tr[data-board-id="${boardId}"] [data-testid="board-present"]`)
    await cell.waitFor()
    expect(await cell.locator('span[title]').count()).toBe(0)

    client = connectLive(baseUrl, boardId, { cookie: designer })
    await whenSynced(client)
    const avatar = cell.locator(`span[title="${DEMO_USERS.designer.name}"]`)
    await avatar.waitFor({ timeout: 15_000 })
    expect(await avatar.innerText()).toBe('TR')
    // The colour is the server's, stamped from the account: some real colour, never empty.
    expect(await avatar.evaluate(el => getComputedStyle(el).backgroundColor)).toMatch(/^rgb/)
    await page.screenshot({ path: `${ARTIFACTS}/workspace-presence.png`, fullPage: true })

    client.destroy()
    client = undefined
    await avatar.waitFor({ state: 'detached', timeout: 15_000 })
  }, 60_000)
})
