// The workspace parts library over HTTP: adding parts (models checked by the RF core's rules), the
// stock-list CSV import (a bad row refuses the whole file naming its row and column, and nothing
// of it is stored), and the export, which reads back in as the same parts.
import { beforeAll, describe, expect, inject, it } from 'vitest'
import { DEMO_USERS, signIn } from '../support/auth'

const baseUrl = inject('baseUrl')
let cookie = ''
const stamp = Date.now().toString(36)

async function call(method: string, path: string, body?: unknown) {
  const res = await fetch(`${baseUrl}${path}`, {
    method, headers: { cookie, ...(body === undefined ? {} : { 'content-type': 'application/json' }) },
    body: body === undefined ? undefined : JSON.stringify(body),
  })
  const text = await res.text()
  return { status: res.status, text, json: res.headers.get('content-type')?.includes('json') ? JSON.parse(text) : null }
}

const parts = async () => (await call('GET', '/api/workspaces/brackwater/parts')).json as { partId: string }[]

beforeAll(async () => {
  cookie = await signIn(baseUrl, DEMO_USERS.designer.email, DEMO_USERS.designer.password)
})

describe('parts library', () => {
  it('adds a modelled part and lists it; a duplicate identifier is 409, a capacitor with srf is 400 naming the field', async () => {
    const part = { partId: `T-${stamp}-L1`, kind: 'L', value: 6.8e-9, tolerance: 0.02, q: 40, model: { q: [[1e8, 25], [1e9, 55]], srf: 4.2e9, padC: 0.1e-12 }, stocked: true }
    const created = await call('POST', '/api/workspaces/brackwater/parts', part)
    expect(created.status).toBe(201)
    expect(created.json).toMatchObject({ ...part })
    expect((await parts()).some(p => p.partId === part.partId)).toBe(true)
    expect((await call('POST', '/api/workspaces/brackwater/parts', part)).status).toBe(409)
    const bad = await call('POST', '/api/workspaces/brackwater/parts', { partId: `T-${stamp}-C9`, kind: 'C', value: 1e-12, model: { srf: 1e9 } })
    expect(bad.status).toBe(400)
    expect(bad.json.message).toContain('model.srf')
  })

  it('imports a stock list, and refuses a file with one bad row naming row and column, keeping none of it', async () => {
    const good = [
      'part_id,kind,value,tolerance_pct,v_rating_v,q_table,srf_hz,pad_c_f,stocked,description',
      `T-${stamp}-A,L,3.3n,2,,100M:30;1G:58,6.1G,0.12p,yes,wound 0402`,
      `T-${stamp}-B,C,1.5p,,50,1G:400,,,no,`,
    ].join('\n')
    const ok = await call('POST', '/api/workspaces/brackwater/parts/import', { csv: good })
    expect(ok.status).toBe(200)
    expect(ok.json).toEqual({ created: 2, updated: 0 })
    const cases: [string, number, string | null][] = [
      [`part_id,kind,value\nT-${stamp}-X1,L,2.2n\nT-${stamp}-X2,L,2.2q\n`, 3, 'value'],
      [`part_id,kind,value\nT-${stamp}-X1,R,2.2n\n`, 2, 'kind'],
      [`part_id,kind,value,srf_hz\nT-${stamp}-X1,C,2.2p,3G\n`, 2, 'srf_hz'],
      [`part_id,kind,value,q_table\nT-${stamp}-X1,L,2.2n,1G:40;500M:30\n`, 2, 'q_table'],
      [`part_id,kind,value,stocked\nT-${stamp}-X1,L,2.2n,maybe\n`, 2, 'stocked'],
      [`part_id,kind,value\nT-${stamp}-X1,L,2.2n\nT-${stamp}-X1,L,3.3n\n`, 3, 'part_id'],
      [`part_id,kind,colour\nT-${stamp}-X1,L,red\n`, 1, 'colour'],
      [`part_id,kind\nT-${stamp}-X1,L\n`, 1, 'value'],
    ]
    for (const [csv, row, column] of cases) {
      const res = await call('POST', '/api/workspaces/brackwater/parts/import', { csv })
      expect(res.status, csv).toBe(422)
      expect(res.json.data, csv).toEqual({ row, column })
      expect(res.json.message).toContain(`row ${row}`)
    }
    // Nothing of the refused files is stored, not even their good first rows.
    expect((await parts()).some(p => p.partId.startsWith(`T-${stamp}-X`))).toBe(false)
  })

  it('exports the library as CSV that imports back as the same parts', async () => {
    const before = (await call('GET', '/api/workspaces/brackwater/parts')).json as Record<string, unknown>[]
    const exported = await call('GET', '/api/workspaces/brackwater/parts/export')
    expect(exported.status).toBe(200)
    expect(exported.text.split('\n')[0]).toBe('part_id,kind,value,tolerance_pct,v_rating_v,i_rating_a,q,q_table,srf_hz,esl_h,pad_c_f,stocked,description')
    const again = await call('POST', '/api/workspaces/brackwater/parts/import', { csv: exported.text })
    expect(again.status).toBe(200)
    expect(again.json.created).toBe(0)
    const after = (await call('GET', '/api/workspaces/brackwater/parts')).json as Record<string, unknown>[]
    const strip = (rows: Record<string, unknown>[]) => rows.map(({ updatedAt: _u, ...rest }) => rest)
    const close = (a: unknown, b: unknown): boolean => typeof a === 'number' && typeof b === 'number'
      ? Math.abs(a - b) <= 1e-9 * Math.abs(b)
      : Array.isArray(a) && Array.isArray(b) ? a.length === b.length && a.every((x, i) => close(x, b[i]))
        : a && b && typeof a === 'object' && typeof b === 'object'
          ? Object.keys({ ...a, ...b }).every(k => close((a as Record<string, unknown>)[k], (b as Record<string, unknown>)[k]))
          : a === b
    expect(close(strip(after), strip(before))).toBe(true)
  })
})
