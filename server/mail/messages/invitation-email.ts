import type { Env } from '@server/config/env.ts';
import type { TeamRole } from '@shared/roles.ts';
import { composeEmail, type EmailContent } from '../compose-email.ts';
import { invitationLink } from '../email-links.ts';

export interface InvitationEmailInput {
  teamName: string;
  role: TeamRole;
  inviterName: string;
  /** The secret of the invitation link (only its hash is stored). */
  token: string;
  expiresAt: Date;
}

/** To the invited address: who invites them, to which team, with which role. */
export function invitationEmail(env: Env, input: InvitationEmailInput): EmailContent {
  return composeEmail({
    subject: `${input.inviterName} invites you to the team ${input.teamName} on Stablehand`,
    paragraphs: [
      `${input.inviterName} invites you to join the team ${input.teamName} as ${input.role}.`,
      `Sign in with your GitHub account to accept. The link works until ${input.expiresAt.toISOString().slice(0, 10)} and only once.`,
      'If you did not expect this invitation, you can ignore this message.',
    ],
    action: { label: 'Accept the invitation', url: invitationLink(env, input.token) },
  });
}
