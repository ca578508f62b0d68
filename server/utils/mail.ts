// Outgoing mail through nodemailer. With SMTP_URL set it goes to that server; without it, to the
// local catcher (server/mail/catcher.ts) that keeps each message in the outbox table.
import nodemailer, { type Transporter } from 'nodemailer'
import { startMailCatcher, HEADER_KIND, HEADER_WORKSPACE, type MailCatcher } from '../mail/catcher'

export const MAIL_FROM = process.env.GAMMABOARD_MAIL_FROM || 'Gammaboard <no-reply@gammaboard.invalid>'

interface MailSetup { transport: Transporter, catcher?: MailCatcher }
let setup: Promise<MailSetup> | undefined

export function useMail(): Promise<MailSetup> {
  setup ??= (async () => {
    if (process.env.SMTP_URL) return { transport: nodemailer.createTransport(process.env.SMTP_URL) }
    const catcher = await startMailCatcher(await useDb())
    const transport = nodemailer.createTransport({ host: '127.0.0.1', port: catcher.port, secure: false, ignoreTLS: true })
    return { transport, catcher }
  })()
  return setup
}

export async function closeMail(): Promise<void> {
  if (!setup) return
  const { transport, catcher } = await setup
  transport.close()
  await catcher?.close()
}

export interface OutgoingMail {
  to: string
  subject: string
  text: string
  html: string
  /** invitation | password-reset | snapshot-shared */
  kind: string
  /** The workspace the message concerns: its admins may read it in the outbox. */
  workspaceId?: number
}

export async function sendMail(mail: OutgoingMail): Promise<void> {
  const { transport } = await useMail()
  await transport.sendMail({
    from: MAIL_FROM,
    to: mail.to,
    subject: mail.subject,
    text: mail.text,
    html: mail.html,
    headers: {
      [HEADER_KIND]: mail.kind,
      ...(mail.workspaceId ? { [HEADER_WORKSPACE]: String(mail.workspaceId) } : {}),
    },
  })
}

export const PUBLIC_URL_MISSING = 'Mail with links is off: set GAMMABOARD_PUBLIC_URL to the address people open '
  + 'Gammaboard at (for example https://boards.example.com). Links in mail are never built from request headers.'

/**
 * The origin links in mails point at: GAMMABOARD_PUBLIC_URL, required. WARNING: never the request's
 * Host or X-Forwarded-Host — a forged header would put an attacker's host, with a live reset or
 * invitation token, into a mail to the victim. Null when unset or not an http(s) URL.
 */
export function configuredPublicOrigin(env: NodeJS.ProcessEnv = process.env): string | null {
  const configured = env.GAMMABOARD_PUBLIC_URL?.trim()
  if (!configured) return null
  try {
    const url = new URL(configured)
    if (url.protocol !== 'http:' && url.protocol !== 'https:') return null
    return `${url.origin}${url.pathname.replace(/\/+$/, '')}`
  }
  catch {
    return null
  }
}

/** The public origin for a mailed link, or a 503 saying what to configure. Call it before any work the mail is for. */
export function publicOrigin(): string {
  const origin = configuredPublicOrigin()
  if (!origin) throw createError({ statusCode: 503, message: PUBLIC_URL_MISSING })
  return origin
}
