import { z } from 'zod';
import { pageSchema } from '@shared/api/pagination.ts';
import { idSchema } from '@shared/api/params.ts';
import { teamRoleSchema } from '@shared/roles.ts';

/** `/api/teams/:teamId/invitations/:id`. */
export const invitationParamsSchema = z.object({ teamId: idSchema, id: idSchema });

/** How long an invitation link works. */
export const invitationLifetimeDays = 7;

/** `POST /api/teams/:teamId/invitations`. */
export const createInvitationSchema = z.strictObject({
  email: z.string().trim().toLowerCase().max(254).pipe(z.email('not a valid e-mail address')),
  role: teamRoleSchema,
});
export type CreateInvitation = z.infer<typeof createInvitationSchema>;

export const invitationStatuses = ['pending', 'accepted', 'revoked', 'expired'] as const;
export const invitationStatusSchema = z.enum(invitationStatuses);

/** An invitation as a maintainer sees it: never its secret. */
export const invitationSchema = z.object({
  id: z.number().int().positive(),
  teamId: z.number().int().positive(),
  email: z.string(),
  role: teamRoleSchema,
  status: invitationStatusSchema,
  invitedBy: z.object({ id: z.number().int().positive(), login: z.string() }),
  createdAt: z.iso.datetime({ offset: true }),
  expiresAt: z.iso.datetime({ offset: true }),
  acceptedAt: z.iso.datetime({ offset: true }).nullable(),
  revokedAt: z.iso.datetime({ offset: true }).nullable(),
});
export type Invitation = z.infer<typeof invitationSchema>;

/** `GET /api/teams/:teamId/invitations`: the pending ones, newest first. */
export const invitationPageSchema = pageSchema(invitationSchema);
export type InvitationPage = z.infer<typeof invitationPageSchema>;

/** `POST /api/invitations/accept`: the secret from the invitation link. */
export const acceptInvitationSchema = z.strictObject({
  token: z.string().trim().min(16).max(200),
});
export type AcceptInvitation = z.infer<typeof acceptInvitationSchema>;

/**
 * The answer to accepting: the team, the role the person has now, and what happened. Someone
 * who was already a member keeps the higher of their role and the invited one.
 */
export const acceptedInvitationSchema = z.object({
  team: z.object({ id: z.number().int().positive(), slug: z.string(), name: z.string() }),
  role: teamRoleSchema,
  outcome: z.enum(['joined', 'role-raised', 'role-kept']),
  message: z.string(),
});
export type AcceptedInvitation = z.infer<typeof acceptedInvitationSchema>;
