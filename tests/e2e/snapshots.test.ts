// In Chromium: the demo designer signs in through the form, starts a board from the workspace's
// template, keeps a snapshot, changes the ladder, and restores the snapshot. Screenshots land in
// tests/artifacts/ for a person to look at.
import { beforeAll, describe, expect, inject, it } from 'vitest'
import type { Page } from 'playwright-core'
import { ARTIFACTS, useChromium } from '../support/browser'
import { DEMO_USERS, signIn } from '../support/auth'

const baseUrl = inject('baseUrl')
let page: Page

async function tileIds(): Promise<string[]> {
  return page.locator('[data-testid="ladder-tile"]').evaluateAll(els => els.map(el => el.getAttribute('data-element-id') ?? ''))
}

const browser = useChromium()
beforeAll(async () => {
  page = await (await browser().newContext({ viewport: { width: 1440, height: 900 } })).newPage()
})

describe('snapshots in the browser', () => {
  it('guards pages: a signed-out visitor is sent to sign in', async () => {
    await page.goto(`${baseUrl}/w/brackwater`)
    await page.waitForURL(/\/login\?next=/)
    await page.locator('[data-testid="login-form"]').waitFor()
  })

  it('says what is wrong in the sign-in form', async () => {
    await page.goto(`${baseUrl}/login`)
    await page.locator('[data-testid="login-form"] button[type="submit"]').click()
    expect(await page.locator('[data-testid="error-email"]').textContent()).toMatch(/e-mail/)
    await page.fill('#field-email', DEMO_USERS.designer.email)
    await page.fill('#field-password', 'not the password')
    await page.locator('[data-testid="login-form"] button[type="submit"]').click()
    expect(await page.locator('[data-testid="form-error"]').textContent()).toMatch(/Sign-in failed/)
  })

  it('signs in as the demo designer, starts a board from a template, snapshots and restores it', async () => {
    await page.goto(`${baseUrl}/login`)
    await page.fill('#field-email', DEMO_USERS.designer.email)
    await page.fill('#field-password', DEMO_USERS.designer.password)
    await page.locator('[data-testid="login-form"] button[type="submit"]').click()
    await page.waitForURL(`${baseUrl}/w/brackwater`)
    await page.locator('[data-testid="template-gallery"] svg polyline').first().waitFor()
    expect(await page.locator('[data-testid="boards-table"] tbody tr[data-board-id]').count()).toBeGreaterThanOrEqual(3)
    await page.screenshot({ path: `${ARTIFACTS}/workspace-home.png`, fullPage: true })

    // Other tests in the run publish templates too: take the seeded one by its name.
    await page.locator('[data-testid="template-gallery"] li', { hasText: '915 MHz chip antenna, series L + shunt C' })
      .first().locator('button', { hasText: 'New board from this' }).click()
    const name = `Field trial antenna ${Date.now()}`
    await page.fill('#field-boardName', name)
    await page.locator('[data-testid="new-board-form"] button[type="submit"]').click()
    await page.waitForURL(/\/boards\/[0-9a-f-]{36}$/)
    const boardId = page.url().split('/').pop()!
    await page.locator('[data-testid="ladder-tile"]').first().waitFor()
    const templateTiles = await tileIds()
    expect(templateTiles).toEqual(['ant-l1', 'ant-c1'])
    expect(await page.locator('[data-testid="board-name"]').textContent()).toBe(name)

    await page.locator('[data-testid="snapshots-toggle"]').click()
    await page.fill('#snapshot-label', 'As it came from the template')
    await page.locator('[data-testid="snapshot-drawer"] button[type="submit"]').click()
    await page.locator('[data-testid="snapshot-list"] li[data-snapshot-id]', { hasText: 'As it came from the template' }).waitFor()

    // Change the ladder, preview the snapshot over it, then restore.
    await page.locator('[data-element-id="ant-c1"] [data-testid="tile-delete"]').click()
    await expect.poll(tileIds).toEqual(['ant-l1'])
    const entry = page.locator('[data-testid="snapshot-list"] li[data-snapshot-id]', { hasText: 'As it came from the template' })
    await entry.locator('button', { hasText: 'Preview' }).click()
    await entry.locator('button', { hasText: 'Hide preview' }).waitFor()
    await page.screenshot({ path: `${ARTIFACTS}/snapshot-preview.png` })
    await entry.locator('button', { hasText: 'Restore' }).click()
    await page.locator('[data-testid="snapshot-notice"]', { hasText: 'Restored' }).waitFor()
    await expect.poll(tileIds, { timeout: 10_000 }).toEqual(templateTiles)
    await page.locator('[data-testid="snapshot-list"] li', { hasText: 'Before restoring' }).waitFor()
    await page.screenshot({ path: `${ARTIFACTS}/snapshot-restored.png` })

    // The server agrees: the board holds the template's ladder, and both snapshots are listed.
    const cookie = await signIn(baseUrl, DEMO_USERS.designer.email, DEMO_USERS.designer.password)
    const board = await (await fetch(`${baseUrl}/api/boards/${boardId}`, { headers: { cookie } })).json()
    expect(board.elements.map((e: { id: string }) => e.id)).toEqual(templateTiles)
    const snapshots = await (await fetch(`${baseUrl}/api/boards/${boardId}/snapshots`, { headers: { cookie } })).json()
    expect(snapshots.map((s: { label: string }) => s.label)).toEqual(['Before restoring "As it came from the template"', 'As it came from the template'])
  })

  it('shares a board: its link, and a snapshot mailed to a colleague that lands in the outbox', async () => {
    // A reviewer may share too: sign in as the reviewer in a fresh browser context.
    const reviewer = DEMO_USERS.reviewer
    const designerCookie = await signIn(baseUrl, DEMO_USERS.designer.email, DEMO_USERS.designer.password)
    const created = await fetch(`${baseUrl}/api/boards`, {
      method: 'POST', headers: { 'content-type': 'application/json', cookie: designerCookie },
      body: JSON.stringify({ workspace: 'brackwater', name: `Share test ${Date.now()}` }),
    })
    const boardId = (await created.json()).id as string
    const label = `For review ${Date.now()}`
    expect((await fetch(`${baseUrl}/api/boards/${boardId}/snapshots`, {
      method: 'POST', headers: { 'content-type': 'application/json', cookie: designerCookie }, body: JSON.stringify({ label }),
    })).status).toBe(201)

    const sharer = await (await browser().newContext({ viewport: { width: 1440, height: 900 } })).newPage()
    await sharer.goto(`${baseUrl}/login`)
    await sharer.fill('#field-email', reviewer.email)
    await sharer.fill('#field-password', reviewer.password)
    await sharer.locator('[data-testid="login-form"] button[type="submit"]').click()
    await sharer.waitForURL(`${baseUrl}/w/brackwater`)
    await sharer.goto(`${baseUrl}/boards/${boardId}`)
    await sharer.locator('[data-testid="share-toggle"]').click()
    expect(await sharer.locator('[data-testid="share-link"]').inputValue()).toBe(`${baseUrl}/boards/${boardId}`)
    // Sending without choices says what is missing.
    await sharer.locator('[data-testid="share-send"]').click()
    expect(await sharer.locator('[data-testid="share-error"]').innerText()).toMatch(/Choose a snapshot/)
    await sharer.locator('[data-testid="share-snapshot"] option', { hasText: label }).waitFor({ state: 'attached' })
    await sharer.selectOption('[data-testid="share-snapshot"]', { label })
    await sharer.selectOption('[data-testid="share-recipient"]', DEMO_USERS.designer.email)
    await sharer.fill('[data-testid="share-note"]', 'Please check the shunt C before we order.')
    await sharer.locator('[data-testid="share-send"]').click()
    await sharer.locator('[data-testid="share-sent"]', { hasText: DEMO_USERS.designer.email }).waitFor()
    await sharer.screenshot({ path: `${ARTIFACTS}/share-panel.png` })

    const adminCookie = await signIn(baseUrl, DEMO_USERS.admin.email, DEMO_USERS.admin.password)
    const outbox = await (await fetch(`${baseUrl}/api/workspaces/brackwater/outbox`, { headers: { cookie: adminCookie } })).json()
    const shared = outbox.find((m: { kind: string, to: string[], textBody?: string, text?: string }) =>
      m.kind === 'snapshot-shared' && m.to.includes(DEMO_USERS.designer.email) && JSON.stringify(m).includes(label))
    expect(shared).toBeTruthy()
    expect(JSON.stringify(shared)).toContain(`/boards/${boardId}`)
  })

  it('shows the admin the members table and the mail outbox', async () => {
    const admin = await (await browser().newContext({ viewport: { width: 1280, height: 900 } })).newPage()
    await admin.goto(`${baseUrl}/login`)
    await admin.fill('#field-email', DEMO_USERS.admin.email)
    await admin.fill('#field-password', DEMO_USERS.admin.password)
    await admin.locator('[data-testid="login-form"] button[type="submit"]').click()
    await admin.waitForURL(`${baseUrl}/w/brackwater`)
    const invitee = `e2e-${Date.now()}@brackwater.example`
    await admin.fill('#field-inviteEmail', invitee)
    await admin.locator('[data-testid="invite-form"] button[type="submit"]').click()
    await admin.locator('[data-testid="invite-form"]', { hasText: `Invitation mailed to ${invitee}` }).waitFor()
    await admin.screenshot({ path: `${ARTIFACTS}/workspace-admin.png`, fullPage: true })
    await admin.goto(`${baseUrl}/w/brackwater/outbox`)
    await admin.locator('[data-testid="outbox-list"] li', { hasText: invitee }).first().waitFor()
    await admin.screenshot({ path: `${ARTIFACTS}/outbox.png` })
  })
})
