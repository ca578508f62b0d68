// Outgoing mail through nodemailer. With SMTP_URL set it goes to that server; without it, to the
// local catcher (server/mail/catcher.ts) that keeps each message in the outbox table.
import type { H3Event } from 'h3'
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

/**
 * The address links in mails point at. GAMMABOARD_PUBLIC_URL when set (production should set it:
 * a forged Host header must not put an attacker's host into a reset link), else this request's own
 * origin, never X-Forwarded-Host.
 */
export function publicOrigin(event: H3Event): string {
  const configured = process.env.GAMMABOARD_PUBLIC_URL
  if (configured) return configured.replace(/\/+$/, '')
  return getRequestURL(event, { xForwardedHost: false, xForwardedProto: false }).origin
}
