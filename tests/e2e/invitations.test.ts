// In Chromium: an invitation link opened by someone signed in under another address says so and
// offers to sign out; signing up through the link takes the invited address (not editable) and lands
// in the inviting workspace with the invited role.
import { beforeAll, describe, expect, inject, it } from 'vitest'
import type { Page } from 'playwright-core'
import { ARTIFACTS, useChromium } from '../support/browser'
import { DEMO_USERS, signIn, signInPage } from '../support/auth'
import { linkIn, mailsTo } from '../support/db'

const baseUrl = inject('baseUrl')
const dbFile = inject('dbFile')
let page: Page

const browser = useChromium()
beforeAll(async () => {
  page = await (await browser().newContext({ viewport: { width: 1200, height: 900 } })).newPage()
})

describe('accepting an invitation in the browser', () => {
  it('refuses the wrong signed-in address, then signs up under the invited one and joins', async () => {
    const invitedEmail = `newhire-${Date.now()}@brackwater.example`
    const adminCookie = await signIn(baseUrl, DEMO_USERS.admin.email, DEMO_USERS.admin.password)
    const sent = await fetch(`${baseUrl}/api/workspaces/brackwater/invitations`, {
      method: 'POST', headers: { 'cookie': adminCookie, 'content-type': 'application/json' },
      body: JSON.stringify({ email: invitedEmail, role: 'reviewer' }),
    })
    expect(sent.status).toBe(201)
    const link = linkIn((await mailsTo(dbFile, invitedEmail))[0]!.text_body, '/invite/')

    // Signed in as the demo reviewer, who is not the invited address.
    await signInPage(page, baseUrl, DEMO_USERS.reviewer.email, DEMO_USERS.reviewer.password)
    await page.goto(link)
    const refusal = page.locator('[data-testid="invite-other-address"]')
    await refusal.waitFor()
    expect(await refusal.textContent()).toMatch(/sent to another address.*ines@brackwater\.example/s)
    expect(await page.locator('button', { hasText: 'Join the workspace' }).count()).toBe(0)
    await page.screenshot({ path: `${ARTIFACTS}/invite-other-address.png`, fullPage: true })

    await page.locator('[data-testid="invite-sign-out"]').click()
    await page.locator('[data-testid="invite-sign-up"]').click()
    await page.waitForURL(/\/signup\?invitation=/)
    const email = page.locator('#field-email')
    expect(await email.inputValue()).toBe(invitedEmail)
    expect(await email.getAttribute('readonly')).not.toBeNull()
    await page.fill('#field-name', 'Noor Newhire')
    await page.fill('#field-password', 'a long enough password')
    await page.screenshot({ path: `${ARTIFACTS}/invite-signup.png`, fullPage: true })
    await page.locator('[data-testid="signup-form"] button[type="submit"]').click()
    await page.waitForURL(`${baseUrl}/w/brackwater`)
    expect(await page.locator('[data-testid="my-role"]').textContent()).toMatch(/reviewer/)

    // The invitation is used up.
    expect((await fetch(`${baseUrl}/api/invitations/${link.split('/invite/')[1]}`)).status).toBe(404)
  })
})
