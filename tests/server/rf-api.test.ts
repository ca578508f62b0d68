// The RF computation routes against the built server: each answer equals the shared/rf function
// called here on the same arguments; bad input gets 400 naming the field; the Touchstone upload
// gets the reference files (tests/fixtures/reference/touchstone) and an oversized body.
import { readFileSync } from 'node:fs'
import { REFERENCE_ROOT } from '../support/reference'
import { request } from 'node:http'
import path from 'node:path'
import { describe, expect, inject, it } from 'vitest'
import {
  parseTouchstone, relativeDifference, solveL, solveStub, sweep, trace,
  type Complex, type Element,
} from '../../shared/rf/index'

const baseUrl = inject('baseUrl')
const REFERENCE_DIR = path.resolve(REFERENCE_ROOT, 'touchstone')
const MALFORMED_FILES = (JSON.parse(readFileSync(path.join(REFERENCE_DIR, 'expected.json'), 'utf8')) as
  { malformed: { file: string, error: { line: number | null, message: string } }[] }).malformed
const MB = 1024 * 1024

// Our invented scenario: the Brackwater soil node's 915 MHz chip antenna, matched on 50 Ω.
const ANTENNA: Complex = { re: 18, im: -32 }
const LADDER: Element[] = [
  { kind: 'L', placement: 'series', value: 8.2e-9, q: 40 },
  { kind: 'C', placement: 'shunt', value: 2.2e-12 },
  { kind: 'line', z0: 50, deg: 12, fRef: 915e6 },
  { kind: 'stub', end: 'short', placement: 'shunt', z0: 60, deg: 30, fRef: 915e6 },
  { kind: 'xfmr', ratio: 1.2 },
]

async function post(route: string, body: unknown, raw?: string) {
  const res = await fetch(`${baseUrl}/api/rf/${route}`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: raw ?? JSON.stringify(body),
  })
  return { status: res.status, body: await res.json() as any }
}

function expectSameImpedances(got: Complex[], want: Complex[]) {
  expect(got).toHaveLength(want.length)
  want.forEach((z, k) => expect(relativeDifference(got[k]!, z, 1e-12), `point ${k}`).toBeLessThanOrEqual(1e-12))
}

describe('POST /api/rf/trace, sweep, solve-l, solve-stub: answers', () => {
  it('trace answers the impedances after 0…n elements, as trace() does', async () => {
    const args = { z0: 50, frequency: 915e6, load: ANTENNA, elements: LADDER }
    const { status, body } = await post('trace', args)
    expect(status).toBe(200)
    expect(Array.isArray(body)).toBe(true)
    expectSameImpedances(body, trace(args))
  })

  it('sweep answers the source-end impedance per frequency, for one load and one load per frequency', async () => {
    const frequencies = Array.from({ length: 401 }, (_, k) => 902e6 + k * 65e3)
    const one = { z0: 50, frequencies, load: ANTENNA, elements: LADDER }
    const first = await post('sweep', one)
    expect(first.status).toBe(200)
    expectSameImpedances(first.body, sweep(one))
    const perFrequency = { ...one, load: frequencies.map((f, k) => ({ re: 18 + k / 100, im: -32 + f / 1e8 })) }
    const second = await post('sweep', perFrequency)
    expect(second.status).toBe(200)
    expectSameImpedances(second.body, sweep(perFrequency))
  })

  it('solve-l answers every L network (element arrays), as solveL() does', async () => {
    const args = { z0: 50, frequency: 915e6, from: ANTENNA, to: { re: 50, im: 0 } }
    const { status, body } = await post('solve-l', args)
    const want = solveL(args)
    expect(status).toBe(200)
    expect(want.length).toBeGreaterThan(0)
    expect(body).toHaveLength(want.length)
    want.forEach((ladder, k) => {
      expect(body[k].map((e: Element) => [e.kind, 'placement' in e ? e.placement : '']))
        .toEqual(ladder.map(e => [e.kind, 'placement' in e ? e.placement : '']))
      ladder.forEach((e, i) => {
        if ('value' in e) expect(Math.abs(body[k][i].value - e.value) / e.value).toBeLessThanOrEqual(1e-12)
      })
    })
  })

  it('solve-stub answers [{ d, l }] in wavelengths, as solveStub() does', async () => {
    const args = { z0: 50, frequency: 915e6, load: ANTENNA, end: 'open' as const }
    const { status, body } = await post('solve-stub', args)
    const want = solveStub(args)
    expect(status).toBe(200)
    expect(want.length).toBeGreaterThan(0)
    expect(body).toHaveLength(want.length)
    want.forEach((s, k) => {
      expect(Math.abs(body[k].d - s.d)).toBeLessThanOrEqual(1e-12)
      expect(Math.abs(body[k].l - s.l)).toBeLessThanOrEqual(1e-12)
    })
  })

  it('sends an open as { re: "Infinity", im: 0 }, never as null, and takes one the same way', async () => {
    const open = await post('trace', { z0: 50, frequency: 915e6, load: { re: 'Infinity', im: 0 }, elements: [{ kind: 'C', placement: 'shunt', value: 1e-12 }] })
    expect(open.status).toBe(200)
    expect(open.body[0]).toEqual({ re: 'Infinity', im: 0 })
    const want = trace({ z0: 50, frequency: 915e6, load: { re: Infinity, im: 0 }, elements: [{ kind: 'C', placement: 'shunt', value: 1e-12 }] })
    expectSameImpedances([open.body[1]], [want[1]!])
  })
})

describe('POST /api/rf/*: bad input is a 400 naming the field', () => {
  const trace0 = { z0: 50, frequency: 915e6, load: ANTENNA, elements: LADDER }
  const cases: [string, string, unknown, string][] = [
    ['trace', 'missing frequency', { ...trace0, frequency: undefined }, 'frequency'],
    ['trace', 'frequency as text', { ...trace0, frequency: '915e6' }, 'frequency'],
    ['trace', 'NaN as a string', { ...trace0, load: { re: 'NaN', im: 0 } }, 'load'],
    ['trace', 'negative Z0', { ...trace0, z0: -50 }, 'z0'],
    ['trace', 'negative capacitance', { ...trace0, elements: [{ kind: 'C', placement: 'shunt', value: -1e-12 }] }, 'elements.0.value'],
    ['trace', 'unknown element kind', { ...trace0, elements: [{ kind: 'diode', placement: 'shunt', value: 1 }] }, 'elements.0.kind'],
    ['trace', 'a measured block (needs an upload)', { ...trace0, elements: [{ kind: 'block', uploadId: 'u1', name: 'filter' }] }, 'elements.0.kind'],
    ['trace', 'elements not an array', { ...trace0, elements: 'L' }, 'elements'],
    ['trace', '201 elements', { ...trace0, elements: Array.from({ length: 201 }, () => LADDER[1]) }, 'elements'],
    ['sweep', 'a line without fRef (from the RF core)', { z0: 50, frequencies: [9e8, 9.1e8], load: ANTENNA, elements: [{ kind: 'line', z0: 50, deg: 30 }] }, 'elements[0].fRef'],
    ['sweep', 'loads that do not match the frequencies (from the RF core)', { z0: 50, frequencies: [9e8, 9.1e8], load: [ANTENNA], elements: [] }, 'load'],
    ['sweep', 'no frequencies', { z0: 50, frequencies: [], load: ANTENNA, elements: [] }, 'frequencies'],
    ['sweep', '100,002 frequencies', { z0: 50, frequencies: Array.from({ length: 100_002 }, (_, k) => 1e6 + k), load: ANTENNA, elements: [] }, 'frequencies'],
    ['sweep', 'a zero frequency', { z0: 50, frequencies: [0, 1e9], load: ANTENNA, elements: [] }, 'frequencies.0'],
    ['solve-l', 'missing to', { z0: 50, frequency: 915e6, from: ANTENNA }, 'to'],
    ['solve-l', 'from as text', { z0: 50, frequency: 915e6, from: '18-32j', to: 50 }, 'from'],
    ['solve-stub', 'unknown end', { z0: 50, frequency: 915e6, load: ANTENNA, end: 'shorted' }, 'end'],
    ['solve-stub', 'negative stub Z0', { z0: 50, frequency: 915e6, load: ANTENNA, end: 'open', stubZ0: -1 }, 'stubZ0'],
  ]

  it.each(cases)('%s: %s', async (route, _what, body, field) => {
    const res = await post(route, body)
    expect(res.status).toBe(400)
    expect(res.body.statusCode).toBe(400)
    expect(res.body.message).toContain(field)
  })

  it('gives the RF core argument in data for errors found by the core', async () => {
    const res = await post('sweep', { z0: 50, frequencies: [9e8], load: ANTENNA, elements: [{ kind: 'stub', end: 'open', placement: 'shunt', z0: 50, deg: 30 }] })
    expect(res.status).toBe(400)
    expect(res.body.data.argument).toBe('elements[0].fRef')
  })

  it.each(['trace', 'sweep', 'solve-l', 'solve-stub'])('%s: malformed JSON', async (route) => {
    const res = await post(route, undefined, '{"z0": 50, "frequency": ')
    expect(res.status).toBe(400)
    expect(res.body.message).toMatch(/JSON/)
  })
})

// ---- Touchstone upload ---------------------------------------------------------------------------

async function upload(fileName: string, text: string, field = 'file') {
  const form = new FormData()
  form.append(field, new Blob([text], { type: 'application/octet-stream' }), fileName)
  const res = await fetch(`${baseUrl}/api/rf/touchstone`, { method: 'POST', body: form })
  return { status: res.status, body: await res.json() as any }
}

/**
 * Streams `totalBytes` of multipart body in 1 MB chunks without a Content-Length and stops as soon
 * as an answer arrives; resolves with the status and how many bytes had been sent by then.
 */
function streamOversizeUpload(totalBytes: number): Promise<{ status: number, sentBytes: number, body: any }> {
  const boundary = 'brackwater-boundary-7f3a'
  const head = Buffer.from(`--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="huge.s1p"\r\nContent-Type: application/octet-stream\r\n\r\n# MHz S RI R 50\r\n`)
  const row = Buffer.from('915 0.1 0.2\r\n'.repeat(80_000)).subarray(0, MB)
  return new Promise((resolve, reject) => {
    let sentBytes = 0
    let isAnswered = false
    const req = request(`${baseUrl}/api/rf/touchstone`, {
      method: 'POST',
      headers: { 'content-type': `multipart/form-data; boundary=${boundary}`, 'transfer-encoding': 'chunked' },
    }, (res) => {
      isAnswered = true
      let text = ''
      res.on('data', (d) => { text += d })
      res.on('end', () => { resolve({ status: res.statusCode!, sentBytes, body: JSON.parse(text) }); req.destroy() })
    })
    req.on('error', (error) => { if (!isAnswered) reject(error) })
    const pump = () => {
      while (!isAnswered && sentBytes < totalBytes) {
        const chunk = sentBytes === 0 ? head : row
        sentBytes += chunk.length
        if (!req.write(chunk)) return void req.once('drain', pump)
      }
      if (!isAnswered) req.end(`\r\n--${boundary}--\r\n`)
    }
    pump()
  })
}

describe('POST /api/rf/touchstone', () => {
  it('answers a good file with the parsed data, as parseTouchstone() gives it', async () => {
    const text = readFileSync(path.join(REFERENCE_DIR, 'amp_noise_ghz.s2p'), 'utf8')
    const { status, body } = await upload('amp_noise_ghz.s2p', text)
    expect(status).toBe(200)
    const want = parseTouchstone(text, 'amp_noise_ghz.s2p')
    expect([body.ports, body.z0, body.format, body.parameter]).toEqual([want.ports, want.z0, want.format, want.parameter])
    expect(body.frequencies).toEqual(want.frequencies)
    want.s.forEach((m, k) => m.forEach((row, i) => row.forEach((v, j) => {
      expect(relativeDifference(body.s[k][i][j], v, 1e-15), `s[${k}][${i}][${j}]`).toBeLessThanOrEqual(1e-15)
    })))
    expect(body.noise).toHaveLength(3)
  })

  it.each(MALFORMED_FILES.map(m => [m.file, m.error] as const))('%s is a 422 with the line', async (file, error) => {
    const { status, body } = await upload(file, readFileSync(path.join(REFERENCE_DIR, file), 'utf8'))
    expect(status).toBe(422)
    expect(body.data.line).toBe(error.line)
    expect(body.message).toContain(error.message)
  })

  it('gives the column of a bad token', async () => {
    const { status, body } = await upload('bad.s1p', '# MHz S RI R 50\n800 0.1 0.2\n810 0.11 abc\n')
    expect(status).toBe(422)
    expect(body.data).toMatchObject({ line: 3, column: 10, code: 'non-numeric' })
  })

  it('answers 400 without a `file` field, and for a request that is not multipart', async () => {
    const wrongField = await upload('a.s1p', '# MHz S RI R 50\n800 0.1 0.2\n', 'document')
    expect(wrongField.status).toBe(400)
    expect(wrongField.body.message).toContain("'file'")
    const json = await post('touchstone', { file: '# MHz S RI R 50\n800 0.1 0.2\n' })
    expect(json.status).toBe(400)
    expect(json.body.message).toMatch(/multipart/)
    const noBoundary = await fetch(`${baseUrl}/api/rf/touchstone`, { method: 'POST', headers: { 'content-type': 'multipart/form-data' }, body: 'x' })
    expect(noBoundary.status).toBe(400)
  })

  it.each([
    ['touchstone', 'multipart/form-data; boundary=x', 21 * MB],
    ['sweep', 'application/json', 17 * MB],
  ])('%s: answers 413 from a declared Content-Length before reading the body', async (route, contentType, bytes) => {
    const status = await new Promise<number>((resolve, reject) => {
      const req = request(`${baseUrl}/api/rf/${route}`, { method: 'POST', headers: { 'content-type': contentType, 'content-length': String(bytes) } }, (res) => {
        res.resume()
        resolve(res.statusCode!)
        req.destroy()
      })
      req.on('error', reject)
      req.flushHeaders() // headers only: the body never comes
    })
    expect(status).toBe(413)
  })

  it('answers 413 for a 21 MB upload', async () => {
    const res = await fetch(`${baseUrl}/api/rf/touchstone`, {
      method: 'POST',
      body: (() => { const form = new FormData(); form.append('file', new Blob([Buffer.alloc(21 * MB, 0x20)]), 'huge.s1p'); return form })(),
    })
    expect(res.status).toBe(413)
    expect((await res.json() as any).message).toMatch(/MB/)
  })

  it('answers 413 while a body without Content-Length is still arriving, once past 20 MB', async () => {
    const total = 64 * MB
    const { status, sentBytes, body } = await streamOversizeUpload(total)
    expect(status).toBe(413)
    expect(body.statusCode).toBe(413)
    expect(sentBytes).toBeGreaterThan(20 * MB)
    expect(sentBytes, 'the answer came before the body was sent').toBeLessThan(total)
  })
})
