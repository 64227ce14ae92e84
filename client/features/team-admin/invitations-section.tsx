import { zodResolver } from '@hookform/resolvers/zod';
import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { useForm } from 'react-hook-form';
import { toast } from 'sonner';
import type { z } from 'zod';
import { EmptyState } from '@client/components/empty-state.tsx';
import { ErrorState } from '@client/components/error-state.tsx';
import { LoadingState } from '@client/components/loading-state.tsx';
import { formatDateTime } from '@client/components/number-format.ts';
import { errorMessage } from '@client/features/review/error-message.ts';
import { Section } from '@client/features/review/section.tsx';
import { createInvitationSchema } from '@shared/api/invitations.ts';
import { teamRoles } from '@shared/roles.ts';
import { invite, revokeInvitation, teamAdminQueries } from './team-admin.queries.ts';

type InviteInput = z.input<typeof createInvitationSchema>;
type InviteOutput = z.output<typeof createInvitationSchema>;

/** Invitations by e-mail with a role: send, list the pending ones, revoke. */
export function InvitationsSection({ teamId }: { teamId: number }) {
  const queryClient = useQueryClient();
  const invitations = useQuery(teamAdminQueries.invitations(teamId));
  const form = useForm<InviteInput, unknown, InviteOutput>({
    resolver: zodResolver(createInvitationSchema),
    defaultValues: { email: '', role: 'author' },
  });
  const refresh = () => queryClient.invalidateQueries({ queryKey: ['team-admin', teamId] });
  const sending = useMutation({
    mutationFn: (body: InviteOutput) => invite(teamId, body),
    onSuccess: async (inv) => {
      toast.success(`Invitation sent to ${inv.email} as ${inv.role}`);
      form.reset({ email: '', role: form.getValues('role') });
      await refresh();
    },
    onError: (error) => toast.error(`No invitation was sent: ${errorMessage(error)}`),
  });
  const revoking = useMutation({
    mutationFn: (id: number) => revokeInvitation(teamId, id),
    onSuccess: async (inv) => {
      toast.success(`The invitation to ${inv.email} is revoked`);
      await refresh();
    },
    onError: (error) => toast.error(`The invitation was not revoked: ${errorMessage(error)}`),
  });
  const emailError = form.formState.errors.email?.message;
  return (
    <Section title="Invitations" id="invitations">
      <form
        noValidate
        onSubmit={form.handleSubmit((v) => sending.mutate(v))}
        className="flex flex-wrap items-end gap-3"
      >
        <label className="text-sm">
          <span className="block font-medium">E-mail address</span>
          <input
            type="email"
            autoComplete="off"
            aria-invalid={emailError ? true : undefined}
            className="w-72 rounded border border-rule bg-white px-2 py-1"
            {...form.register('email')}
          />
        </label>
        <label className="text-sm">
          <span className="block font-medium">Role</span>
          <select
            className="rounded border border-rule bg-white px-2 py-1"
            {...form.register('role')}
          >
            {teamRoles.map((r) => (
              <option key={r} value={r}>
                {r}
              </option>
            ))}
          </select>
        </label>
        <button
          type="submit"
          disabled={sending.isPending}
          className="rounded border border-ink bg-ink px-3 py-1.5 text-sm font-medium text-paper disabled:opacity-60"
        >
          Send invitation
        </button>
      </form>
      {emailError ? <p className="mt-1 text-sm text-beyond">✕ {emailError}</p> : null}
      <div className="mt-4">
        {invitations.isPending ? (
          <LoadingState label="Loading the invitations…" />
        ) : invitations.isError ? (
          <ErrorState error={invitations.error} onRetry={() => void invitations.refetch()} />
        ) : invitations.data.items.length === 0 ? (
          <EmptyState title="No invitation is pending." />
        ) : (
          <ul
            className="divide-y divide-rule rounded border border-rule text-sm"
            data-testid="invitations-list"
          >
            {invitations.data.items.map((inv) => (
              <li key={inv.id} className="flex flex-wrap items-center justify-between gap-3 p-2">
                <span>
                  <span className="font-mono">{inv.email}</span> as {inv.role} · invited by{' '}
                  {inv.invitedBy.login} · expires {formatDateTime(inv.expiresAt)}
                </span>
                <button
                  type="button"
                  onClick={() => revoking.mutate(inv.id)}
                  disabled={revoking.isPending}
                  className="text-beyond underline"
                  aria-label={`Revoke the invitation to ${inv.email}`}
                >
                  Revoke
                </button>
              </li>
            ))}
          </ul>
        )}
      </div>
    </Section>
  );
}
