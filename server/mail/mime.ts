// Just enough MIME reading for the local mail catcher: headers, (nested) multipart bodies,
// base64 and quoted-printable parts, encoded-word subjects. Our own messages are the input.

export interface ParsedMail {
  headers: Map<string, string>
  subject: string
  text: string
  html: string
}

function splitHead(raw: string): { head: string, body: string } {
  const match = /\r?\n\r?\n/.exec(raw)
  if (!match) return { head: raw, body: '' }
  return { head: raw.slice(0, match.index), body: raw.slice(match.index + match[0].length) }
}

function parseHeaders(head: string): Map<string, string> {
  const headers = new Map<string, string>()
  // Folded header lines continue with leading whitespace (RFC 5322 §2.2.3).
  for (const line of head.replace(/\r?\n[ \t]+/g, ' ').split(/\r?\n/)) {
    const colon = line.indexOf(':')
    if (colon > 0) headers.set(line.slice(0, colon).trim().toLowerCase(), line.slice(colon + 1).trim())
  }
  return headers
}

function headerParam(value: string, name: string): string | undefined {
  const match = new RegExp(`${name}\\s*=\\s*(?:"([^"]*)"|([^;\\s]+))`, 'i').exec(value)
  return match ? (match[1] ?? match[2]) : undefined
}

function decodeQuotedPrintable(text: string): Buffer {
  const soft = text.replace(/=\r?\n/g, '')
  const bytes: number[] = []
  for (let i = 0; i < soft.length; i++) {
    const hex = soft.slice(i + 1, i + 3)
    if (soft[i] === '=' && /^[0-9A-Fa-f]{2}$/.test(hex)) {
      bytes.push(Number.parseInt(hex, 16))
      i += 2
    }
    else bytes.push(...Buffer.from(soft[i]!, 'utf8'))
  }
  return Buffer.from(bytes)
}

function decodeBody(body: string, encoding: string | undefined): string {
  switch ((encoding ?? '7bit').toLowerCase()) {
    case 'base64': return Buffer.from(body.replace(/\s+/g, ''), 'base64').toString('utf8')
    case 'quoted-printable': return decodeQuotedPrintable(body).toString('utf8')
    default: return body
  }
}

/** RFC 2047 encoded words (=?utf-8?B?...?= and =?utf-8?Q?...?=). */
export function decodeEncodedWords(value: string): string {
  return value.replace(/=\?[^?]+\?([BbQq])\?([^?]*)\?=(\s+(?==\?))?/g, (_all, kind: string, data: string) =>
    kind.toUpperCase() === 'B'
      ? Buffer.from(data, 'base64').toString('utf8')
      : decodeQuotedPrintable(data.replace(/_/g, ' ')).toString('utf8'))
}

function collectParts(headers: Map<string, string>, body: string, into: { text: string, html: string }): void {
  const type = headers.get('content-type') ?? 'text/plain'
  if (/^multipart\//i.test(type)) {
    const boundary = headerParam(type, 'boundary')
    if (!boundary) return
    const pieces = body.split(`--${boundary}`).slice(1)
    for (const piece of pieces) {
      if (piece.startsWith('--')) break
      const { head, body: partBody } = splitHead(piece.replace(/^\r?\n/, ''))
      collectParts(parseHeaders(head), partBody.replace(/\r?\n$/, ''), into)
    }
    return
  }
  const decoded = decodeBody(body, headers.get('content-transfer-encoding'))
  if (/^text\/html/i.test(type)) into.html ||= decoded
  else if (/^text\/plain/i.test(type)) into.text ||= decoded
}

export function parseMail(raw: string): ParsedMail {
  const { head, body } = splitHead(raw)
  const headers = parseHeaders(head)
  const parts = { text: '', html: '' }
  collectParts(headers, body, parts)
  return { headers, subject: decodeEncodedWords(headers.get('subject') ?? ''), ...parts }
}
