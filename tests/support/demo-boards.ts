// Boards for tests that edit: boards are live and stored, so each test that edits gets its own,
// usually a copy of the demo antenna template (series L ant-l1, shunt C ant-c1).
import { expect } from 'vitest'

export const ANTENNA_TEMPLATE = '915 MHz chip antenna, series L + shunt C'

/** The id of the demo workspace's template called `name`. */
export async function demoTemplateId(baseUrl: string, cookie: string, name = ANTENNA_TEMPLATE): Promise<string> {
  const templates = await (await fetch(`${baseUrl}/api/workspaces/brackwater/templates`, { headers: { cookie } })).json()
  const found = templates.find((t: { name: string }) => t.name === name)
  expect(found, `demo template "${name}"`).toBeTruthy()
  return found.id
}

/** A new board in the demo workspace (from `templateId` when given); answers its id. */
export async function newDemoBoard(baseUrl: string, cookie: string, name: string, templateId?: string): Promise<string> {
  const res = await fetch(`${baseUrl}/api/boards`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', cookie },
    body: JSON.stringify({ workspace: 'brackwater', name, ...(templateId ? { templateId } : {}) }),
  })
  expect(res.status).toBe(201)
  return (await res.json()).id
}
