// The words of every mail we send, each with a plain-text and an HTML part.

function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, c => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', '\'': '&#39;' }[c]!))
}

function page(paragraphs: string[], link: { href: string, label: string }, footer: string): string {
  const body = paragraphs.map(p => `<p style="margin:0 0 12px">${escapeHtml(p)}</p>`).join('')
  return `<!doctype html><html><body style="font-family:'Work Sans',system-ui,sans-serif;background:#f7f5f0;color:#2b2f36;padding:24px">`
    + `<div style="max-width:520px;margin:auto;background:#fff;border:1px solid #e5e1d8;border-radius:8px;padding:24px">`
    + `<p style="font-weight:600;margin:0 0 16px">Gammaboard</p>${body}`
    + `<p style="margin:20px 0"><a href="${escapeHtml(link.href)}" style="background:#2f8f8a;color:#fff;padding:10px 16px;border-radius:6px;text-decoration:none">${escapeHtml(link.label)}</a></p>`
    + `<p style="font-size:12px;color:#5b616b;margin:0">${escapeHtml(footer)}</p></div></body></html>`
}

export function invitationMail(input: { inviterName: string, workspaceName: string, role: string, link: string }) {
  const lines = [
    `${input.inviterName} invited you to the workspace "${input.workspaceName}" on Gammaboard as a ${input.role}.`,
    'Open the link to join. If you have no account yet, you can create one on the same page.',
  ]
  const footer = 'The link works once and expires in 7 days. If you did not expect this, ignore this message.'
  return {
    subject: `Join ${input.workspaceName} on Gammaboard`,
    text: `${lines.join('\n\n')}\n\n${input.link}\n\n${footer}\n`,
    html: page(lines, { href: input.link, label: 'Join the workspace' }, footer),
  }
}

export function passwordResetMail(input: { name: string, link: string }) {
  const lines = [
    `Hello ${input.name},`,
    'someone (hopefully you) asked to choose a new Gammaboard password for this address. Open the link to set one.',
  ]
  const footer = 'The link works once and expires in 1 hour. If you did not ask for it, ignore this message; your password stays as it is.'
  return {
    subject: 'Choose a new Gammaboard password',
    text: `${lines.join('\n')}\n\n${input.link}\n\n${footer}\n`,
    html: page(lines, { href: input.link, label: 'Choose a new password' }, footer),
  }
}

export function snapshotSharedMail(input: { senderName: string, boardName: string, label: string, link: string, note?: string }) {
  const lines = [
    `${input.senderName} shared the snapshot "${input.label}" of the board "${input.boardName}" with you.`,
    ...(input.note ? [`Their note: ${input.note}`] : []),
  ]
  const footer = 'You can open it because you are a member of the board\'s workspace.'
  return {
    subject: `Snapshot shared: ${input.label}`,
    text: `${lines.join('\n\n')}\n\n${input.link}\n\n${footer}\n`,
    html: page(lines, { href: input.link, label: 'Open the board' }, footer),
  }
}

export function commentMentionMail(input: { writerName: string, boardName: string, excerpt: string, link: string }) {
  const excerpt = input.excerpt.length > 500 ? `${input.excerpt.slice(0, 500)}…` : input.excerpt
  const lines = [
    `${input.writerName} mentioned you in a comment on the board "${input.boardName}":`,
    excerpt,
  ]
  const footer = 'You get this because you are a member of the board\'s workspace and were mentioned by name.'
  return {
    subject: `${input.writerName} mentioned you on ${input.boardName}`,
    text: `${lines.join('\n\n')}\n\n${input.link}\n\n${footer}\n`,
    html: page(lines, { href: input.link, label: 'Open the comment' }, footer),
  }
}
