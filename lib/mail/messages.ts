import type { OutgoingMail } from './transport'

export function appUrl(): string {
  return (process.env.APP_URL || 'http://localhost:3000').replace(/\/$/, '')
}

const SIGNATURE = '\n\n— Inverso\nThis message was sent because someone used your address in Inverso. If you did not expect it, ignore it.'

export function invitationMail(to: string, token: string, projectName: string, roleLabel: string, inviter: string): OutgoingMail {
  return {
    to,
    subject: `Invitation to ${projectName} on Inverso`,
    text:
      `${inviter} invited you to the project "${projectName}" as ${roleLabel}.\n\n` +
      `Set your password and sign in here (the link works for 7 days):\n${appUrl()}/invite/${token}` +
      SIGNATURE,
  }
}

export function addedToProjectMail(to: string, projectName: string, roleLabel: string, inviter: string): OutgoingMail {
  return {
    to,
    subject: `You were added to ${projectName} on Inverso`,
    text: `${inviter} added you to the project "${projectName}" as ${roleLabel}.\n\nSign in: ${appUrl()}/sign-in` + SIGNATURE,
  }
}

export function passwordResetMail(to: string, token: string): OutgoingMail {
  return {
    to,
    subject: 'Reset your Inverso password',
    text: `Choose a new password here (the link works for 1 hour):\n${appUrl()}/reset/${token}` + SIGNATURE,
  }
}
