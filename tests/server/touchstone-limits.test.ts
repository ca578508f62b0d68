// Hostile Touchstone uploads against a server of its own (a crash must not take the shared one
// down): a huge port count from the file name or from [Number of Ports], a million-line file and
// a 20 MB token each get a short 422 naming the line, and the server keeps answering.
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { startServer, type RunningServer } from '../support/server'

let server: RunningServer

beforeAll(async () => {
  server = await startServer()
})

afterAll(async () => {
  await server?.stop()
})

async function upload(fileName: string, text: string) {
  const form = new FormData()
  form.append('file', new Blob([text]), fileName)
  const res = await fetch(`${server.url}/api/rf/touchstone`, { method: 'POST', body: form })
  const raw = await res.text()
  return { status: res.status, bytes: raw.length, body: JSON.parse(raw) }
}

async function expectAlive() {
  expect(server.process.exitCode, 'the server process exited').toBeNull()
  expect((await fetch(`${server.url}/api/health`)).status).toBe(200)
}

describe('POST /api/rf/touchstone refuses what the product cannot use, before holding it', () => {
  it.each([
    ['x.s12000p', 12000],
    ['x.s6000p', 6000],
    ['x.s3p', 3],
  ])('%s (a tiny anonymous file) is a 422 naming its first data line', async (fileName, ports) => {
    const { status, body } = await upload(fileName, '! probe\n# GHz S RI R 50\n1 0 0\n')
    expect(status).toBe(422)
    expect(body.data).toMatchObject({ line: 3, code: 'port-count' })
    expect(body.message).toContain(`${ports} ports`)
    await expectAlive()
  })

  it('[Number of Ports] 1000000000 is a 422 naming that line and the value\'s column', async () => {
    const text = ['[Version] 2.0', '# GHz S RI R 50', '[Number of Ports] 1000000000', '[Number of Frequencies] 1', '[Network Data]', '1 0 0', '[End]', ''].join('\n')
    const { status, body } = await upload('big.ts', text)
    expect(status).toBe(422)
    expect(body.data).toMatchObject({ line: 3, column: 19, code: 'port-count' })
    await expectAlive()
  })

  it('a million-line file stops at the first frequency past 20,001 with a short 422', async () => {
    const rows = Array.from({ length: 1_000_000 }, (_, k) => `${k + 1} 0.1 0.2`)
    const { status, body, bytes } = await upload('long.s1p', `# Hz S RI R 50\n${rows.join('\n')}\n`)
    expect(status).toBe(422)
    expect(body.data).toMatchObject({ line: 20_003, code: 'too-many-frequencies' })
    expect(bytes).toBeLessThan(2000)
    await expectAlive()
  })

  it('a 20 MB token is not echoed back', async () => {
    const { status, body, bytes } = await upload('token.s1p', `# MHz S RI R 50\n800 0.1 ${'7'.repeat(19 * 1024 * 1024)}x\n`)
    expect(status).toBe(422)
    expect(body.data).toMatchObject({ line: 2, column: 9 })
    expect(bytes).toBeLessThan(2000)
    await expectAlive()
  })

  it('still reads a good file after all that (a fresh worker where one was lost)', async () => {
    const { status, body } = await upload('ok.s2p', '# MHz S RI R 50\n800 0.1 0.2 0.9 0 0.01 0 0.3 -0.1\n900 0.12 0.2 0.9 0 0.01 0 0.3 -0.1\n')
    expect(status).toBe(200)
    expect(body).toMatchObject({ ports: 2, frequencies: [800e6, 900e6] })
    expect(body.s[0][1][0]).toEqual({ re: 0.9, im: 0 })
  })
})
