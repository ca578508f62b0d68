// The local SMTP catcher for dev, demo and test: an smtp-server on loopback that keeps every
// message it receives in the outbox table instead of delivering it.
import type { AddressInfo } from 'node:net'
import { SMTPServer } from 'smtp-server'
import type { Sequelize } from 'sequelize'
import { modelsFor } from '../models'
import { parseMail } from './mime'

export const HEADER_KIND = 'x-gammaboard-kind'
export const HEADER_WORKSPACE = 'x-gammaboard-workspace'

export interface MailCatcher { port: number, close: () => Promise<void> }

export async function storeCaughtMail(sequelize: Sequelize, raw: string, envelope: { from: string, to: string[] }): Promise<void> {
  const { OutboxMessage } = modelsFor(sequelize)
  const mail = parseMail(raw)
  const workspaceId = Number(mail.headers.get(HEADER_WORKSPACE))
  await OutboxMessage.create({
    workspaceId: Number.isInteger(workspaceId) && workspaceId > 0 ? workspaceId : null,
    kind: mail.headers.get(HEADER_KIND) ?? null,
    mailFrom: envelope.from,
    mailTo: envelope.to.join(','),
    subject: mail.subject.slice(0, 500),
    textBody: mail.text,
    htmlBody: mail.html,
    raw,
  })
}

export async function startMailCatcher(sequelize: Sequelize): Promise<MailCatcher> {
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['AUTH', 'STARTTLS'],
    logger: false,
    size: 5 * 1024 * 1024,
    onData(stream, session, callback) {
      const chunks: Buffer[] = []
      stream.on('data', (chunk: Buffer) => chunks.push(chunk))
      stream.on('end', () => {
        const envelope = {
          from: session.envelope.mailFrom ? session.envelope.mailFrom.address : '',
          to: session.envelope.rcptTo.map(r => r.address),
        }
        // Acknowledge only once stored, so a sender that awaited delivery can read the outbox.
        storeCaughtMail(sequelize, Buffer.concat(chunks).toString('utf8'), envelope)
          .then(() => callback(), error => callback(error as Error))
      })
    },
  })
  await new Promise<void>((ok, fail) => {
    server.once('error', fail)
    server.listen(0, '127.0.0.1', () => ok())
  })
  const { port } = server.server.address() as AddressInfo
  return { port, close: () => new Promise(ok => server.close(() => ok())) }
}
