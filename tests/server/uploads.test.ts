// Measured uploads through the API: every reference Touchstone file, the size limit on the bytes
// received, and who may upload and read. Expected values: tests/fixtures/reference/touchstone/expected.json
// (invented data read back by scikit-rf 0.15.4 and an independent strict reader).
import { readFileSync, readdirSync } from 'node:fs'
import { REFERENCE_ROOT } from '../support/reference'
import http from 'node:http'
import path from 'node:path'
import { beforeAll, describe, expect, inject, it } from 'vitest'
import { DEMO_USERS, signIn } from '../support/auth'

const baseUrl = inject('baseUrl')
const TOUCHSTONE_DIR = path.resolve(REFERENCE_ROOT, 'touchstone')
const SOURCE = 'reference touchstone/expected.json (scikit-rf 0.15.4 and a strict reader)'
const BOARD = 'brackwater-915-antenna'
const MAX_BYTES = 20 * 1024 * 1024

type Pair = [number, number]
const expected = JSON.parse(readFileSync(path.join(TOUCHSTONE_DIR, 'expected.json'), 'utf8')) as {
  tolerance: { freqRel: number, sRel: number }
  valid: { file: string, ports: number, z0: number, freqHz: number[], s: Pair[][][] }[]
  malformed: { file: string, error: { code: string, line: number | null, message: string } }[]
}

let designer = ''
let reviewer = ''

function upload(fileName: string, bytes: Buffer | string, cookie = designer, board = BOARD) {
  const form = new FormData()
  form.append('file', new Blob([bytes]), fileName)
  return fetch(`${baseUrl}/api/boards/${board}/uploads`, { method: 'POST', body: form, headers: { cookie } })
}

function relClose(actual: number, wanted: number, rel: number, floor = 1e-15) {
  return Math.abs(actual - wanted) <= rel * Math.max(Math.abs(wanted), floor) + floor
}

beforeAll(async () => {
  designer = await signIn(baseUrl, DEMO_USERS.designer.email, DEMO_USERS.designer.password)
  reviewer = await signIn(baseUrl, DEMO_USERS.reviewer.email, DEMO_USERS.reviewer.password)
})

describe('POST /api/boards/:id/uploads with the reference files', () => {
  it('covers every file of the reference folder', () => {
    const files = readdirSync(TOUCHSTONE_DIR).filter(f => /\.s\dp$/.test(f)).sort()
    const listed = [...expected.valid.map(v => v.file), ...expected.malformed.map(m => m.file)].sort()
    expect(listed).toEqual(files)
  })

  it.each(expected.valid.map(v => [v.file, v] as const))('%s uploads and reads back with the expected values (%#)', async (file, want) => {
    const res = await upload(file, readFileSync(path.join(TOUCHSTONE_DIR, file)))
    expect(res.status, await res.clone().text()).toBe(201)
    const summary = await res.json()
    expect(summary).toMatchObject({ fileName: file, ports: want.ports, frequencies: want.freqHz.length })
    expect(relClose(summary.fMinHz, want.freqHz[0]!, expected.tolerance.freqRel), SOURCE).toBe(true)
    expect(relClose(summary.fMaxHz, want.freqHz.at(-1)!, expected.tolerance.freqRel), SOURCE).toBe(true)

    const got = await fetch(`${baseUrl}/api/uploads/${summary.id}`, { headers: { cookie: reviewer } })
    expect(got.status).toBe(200)
    const data = await got.json()
    expect(data.fileName).toBe(file)
    expect(data.z0).toBe(want.z0)
    want.freqHz.forEach((f, k) => {
      expect(relClose(data.frequencies[k], f, expected.tolerance.freqRel), `${file} f[${k}] (${SOURCE})`).toBe(true)
      want.s[k]!.forEach((row, i) => row.forEach(([re, im], j) => {
        const v = data.s[k][i][j]
        const err = Math.hypot(v.re - re, v.im - im) / Math.max(Math.hypot(re, im), 1e-300)
        expect(err, `${file} s[${k}][${i}][${j}] (${SOURCE})`).toBeLessThanOrEqual(expected.tolerance.sRel)
      }))
    })
  })

  it.each(expected.malformed.map(m => [m.file, m.error] as const))('%s is refused with 422 naming its line (%#)', async (file, error) => {
    const res = await upload(file, readFileSync(path.join(TOUCHSTONE_DIR, file)))
    expect(res.status).toBe(422)
    const body = await res.json()
    expect(body.data.line, `${file} line (${SOURCE})`).toBe(error.line)
    expect(body.data.code, `${file} code (${SOURCE})`).toBe(error.code)
    expect(body.message).toContain(error.message)
  })
})

/** Posts a multipart body of `fileBytes` bytes with chunked transfer: no Content-Length to go by. */
function postChunked(fileBytes: number): Promise<{ status: number, body: string }> {
  const url = new URL(`${baseUrl}/api/boards/${BOARD}/uploads`)
  const boundary = 'gammaboard-limit-test'
  return new Promise((resolve, reject) => {
    const req = http.request({
      host: url.hostname, port: url.port, path: url.pathname, method: 'POST',
      headers: { 'content-type': `multipart/form-data; boundary=${boundary}`, 'transfer-encoding': 'chunked', cookie: designer },
    }, (res) => {
      let body = ''
      res.on('data', (c) => { body += c })
      res.on('end', () => resolve({ status: res.statusCode ?? 0, body }))
    })
    req.on('error', reject)
    req.write(`--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="huge.s1p"\r\nContent-Type: application/octet-stream\r\n\r\n`)
    const chunk = Buffer.alloc(1024 * 1024, '0.0 ')
    let sent = 0
    const pump = () => {
      while (sent < fileBytes) {
        sent += chunk.length
        if (!req.write(chunk)) return void req.once('drain', pump)
      }
      req.end(`\r\n--${boundary}--\r\n`)
    }
    pump()
  })
}

describe('the 20 MB limit', () => {
  it('answers 413 for a streamed upload past 20 MB (counted on the bytes received)', async () => {
    const res = await postChunked(MAX_BYTES + 2 * 1024 * 1024)
    expect(res.status).toBe(413)
    expect(JSON.parse(res.body).message).toMatch(/20 MB/)
  })

  it('answers 413 for a declared body over 20 MB', async () => {
    const res = await upload('big.s1p', Buffer.alloc(MAX_BYTES + 1024, 0x20))
    expect(res.status).toBe(413)
  })

  it('still takes a file just under the limit (the limit is not set lower)', async () => {
    // ~19 MB of comment lines and one data row: a valid file.
    const filler = '! padding line for the size check ..................................................\n'.repeat(Math.floor(19 * 1024 * 1024 / 88))
    const res = await upload('padded.s1p', `# MHz S RI R 50\n${filler}900 0.1 0.2\n`)
    expect(res.status).toBe(201)
    expect((await res.json()).frequencies).toBe(1)
  })
})

describe('who may upload and read', () => {
  const antenna = () => readFileSync(path.join(TOUCHSTONE_DIR, 'antenna_ri_mhz.s1p'))

  it('401 without a session, 403 for a reviewer, 404 for an unknown board', async () => {
    expect((await upload('a.s1p', antenna(), '')).status).toBe(401)
    expect((await upload('a.s1p', antenna(), reviewer)).status).toBe(403)
    expect((await upload('a.s1p', antenna(), designer, 'no-such-board')).status).toBe(404)
  })

  it('400 without the file field, and for a file of more than two ports', async () => {
    const form = new FormData()
    form.append('other', 'x')
    const res = await fetch(`${baseUrl}/api/boards/${BOARD}/uploads`, { method: 'POST', body: form, headers: { cookie: designer } })
    expect(res.status).toBe(400)
    const three = await upload('triple.s3p', '# GHz S RI R 50\n1 0 0 0 0 0 0\n0 0 0 0 0 0\n0 0 0 0 0 0\n')
    expect(three.status).toBe(422)
  })

  it('GET /api/uploads/:id: 401 signed out, 404 for an unknown id, 400 for a malformed id', async () => {
    const res = await upload('a.s1p', antenna())
    const { id } = await res.json()
    expect((await fetch(`${baseUrl}/api/uploads/${id}`)).status).toBe(401)
    expect((await fetch(`${baseUrl}/api/uploads/00000000-0000-4000-8000-000000000000`, { headers: { cookie: designer } })).status).toBe(404)
    expect((await fetch(`${baseUrl}/api/uploads/not-an-id`, { headers: { cookie: designer } })).status).toBe(400)
  })
})
