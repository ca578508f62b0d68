// Workspace invitations: a one-time link mailed to the invitee, valid for 7 days.
import { Op, type Transaction } from 'sequelize'
import { roleAtLeast, type InvitationInstance, type Role, type UserInstance } from '../models'
import { setMembership } from '../database/accounts'
import { hashToken, newToken } from '../database/tokens'
import type { MemberAccess } from './access'

export const INVITATION_LIFETIME_MS = 7 * 24 * 60 * 60 * 1000

export async function inviteToWorkspace(access: MemberAccess, email: string, role: Role): Promise<InvitationInstance> {
  const origin = publicOrigin()
  const { Invitation, User, Membership } = await useModels()
  const existing = await User.findOne({ where: { email }, attributes: ['id'] })
  if (existing && await Membership.count({ where: { userId: existing.id, workspaceId: access.workspace.id } })) {
    throw createError({ statusCode: 422, message: 'email: this person is already a member of the workspace.' })
  }
  const { token, tokenHash } = newToken()
  const invitation = await Invitation.create({
    workspaceId: access.workspace.id, email, role, tokenHash, invitedBy: access.user.id,
    expiresAt: new Date(Date.now() + INVITATION_LIFETIME_MS),
  })
  const link = `${origin}/invite/${token}`
  await sendMail({
    to: email, kind: 'invitation', workspaceId: access.workspace.id,
    ...invitationMail({ inviterName: access.user.name, workspaceName: access.workspace.name, role, link }),
  })
  return invitation
}

const INVALID = 'This invitation link is invalid, already used or expired: ask an admin for a new one.'

/** The unused, unexpired invitation a token names; 404 otherwise. */
export async function findOpenInvitation(token: string) {
  const { Invitation, Workspace } = await useModels()
  const invitation = await Invitation.findOne({
    where: { tokenHash: hashToken(token), acceptedAt: null, expiresAt: { [Op.gt]: new Date() } },
  })
  const workspace = invitation && await Workspace.findByPk(invitation.workspaceId)
  if (!invitation || !workspace) throw createError({ statusCode: 404, message: INVALID })
  return { invitation, workspace }
}

/** The refusal for anyone but the invited address (signed in as someone else, or signing up with another e-mail). */
export function sentToAnotherAddress(invitedEmail: string) {
  return createError({ statusCode: 403, message: `This invitation was sent to another address: sign in or sign up as ${invitedEmail} to accept it.` })
}

/**
 * Uses the invitation (once) and adds the membership; an existing member keeps the higher role.
 * Runs in the caller's transaction when given one (sign-up creates the account and joins in one step).
 */
export async function acceptInvitation(token: string, user: UserInstance, outer?: Transaction) {
  const sequelize = await useDb()
  const { Invitation, Membership } = await useModels()
  const run = async (transaction: Transaction) => {
    // The link is for the address it was mailed to: someone holding a forwarded link cannot join.
    const open = await Invitation.findOne({ where: { tokenHash: hashToken(token), acceptedAt: null }, transaction })
    if (open && open.email.toLowerCase() !== user.email.toLowerCase()) throw sentToAnotherAddress(open.email)
    // Marking it used first, guarded on "still unused", makes two simultaneous accepts use it once.
    const [used] = await Invitation.update(
      { acceptedAt: new Date(), acceptedBy: user.id },
      { where: { tokenHash: hashToken(token), acceptedAt: null, expiresAt: { [Op.gt]: new Date() } }, transaction },
    )
    if (used !== 1) throw createError({ statusCode: 404, message: INVALID })
    const invitation = (await Invitation.findOne({ where: { tokenHash: hashToken(token) }, transaction }))!
    const current = await Membership.findOne({ where: { userId: user.id, workspaceId: invitation.workspaceId }, transaction })
    if (!current || !roleAtLeast(current.role, invitation.role)) {
      await setMembership(sequelize, { userId: user.id, workspaceId: invitation.workspaceId, role: invitation.role }, transaction)
    }
    const { Workspace } = await useModels()
    const workspace = (await Workspace.findByPk(invitation.workspaceId, { transaction }))!
    return { slug: workspace.slug, name: workspace.name }
  }
  return outer ? run(outer) : sequelize.transaction(run)
}

