import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import { toast } from 'sonner';
import { ErrorState } from '@client/components/error-state.tsx';
import { LoadingState } from '@client/components/loading-state.tsx';
import { formatDateTime } from '@client/components/number-format.ts';
import { errorMessage } from '@client/features/review/error-message.ts';
import { Section } from '@client/features/review/section.tsx';
import type { Member } from '@shared/api/members.ts';
import { teamRoles, type TeamRole } from '@shared/roles.ts';
import { changeRole, removeMember, teamAdminQueries } from './team-admin.queries.ts';

/** Members and their roles; maintainers change roles and remove people. */
export function MembersSection({
  teamId,
  canManage,
  myUserId,
}: {
  teamId: number;
  canManage: boolean;
  myUserId: number | null;
}) {
  const queryClient = useQueryClient();
  const members = useQuery(teamAdminQueries.members(teamId));
  const refresh = () => queryClient.invalidateQueries({ queryKey: ['team-admin', teamId] });
  const roleChange = useMutation({
    mutationFn: ({ member, role }: { member: Member; role: TeamRole }) =>
      changeRole(teamId, member.userId, role),
    onSuccess: async (m) => {
      toast.success(`${m.login} is ${m.role} now`);
      await Promise.all([refresh(), queryClient.invalidateQueries({ queryKey: ['me'] })]);
    },
    onError: (error) => toast.error(`The role did not change: ${errorMessage(error)}`),
  });
  const removal = useMutation({
    mutationFn: (member: Member) => removeMember(teamId, member.userId),
    onSuccess: async (_, member) => {
      toast.success(`${member.login} is no longer in the team`);
      await refresh();
    },
    onError: (error) => toast.error(`Nobody was removed: ${errorMessage(error)}`),
  });
  return (
    <Section title="Members and roles" id="members">
      {members.isPending ? (
        <LoadingState label="Loading the members…" />
      ) : members.isError ? (
        <ErrorState error={members.error} onRetry={() => void members.refetch()} />
      ) : (
        <table className="w-full text-sm" data-testid="members-table">
          <thead className="border-b border-rule text-left text-ink-soft">
            <tr>
              <th className="py-1 pr-4 font-medium">Login</th>
              <th className="py-1 pr-4 font-medium">Name</th>
              <th className="py-1 pr-4 font-medium">Role</th>
              <th className="py-1 pr-4 font-medium">Joined</th>
              {canManage ? <th className="py-1 font-medium">Remove</th> : null}
            </tr>
          </thead>
          <tbody>
            {members.data.items.map((m) => (
              <tr key={m.userId} className="border-b border-rule/60">
                <td className="py-1.5 pr-4 font-mono">
                  {m.login}
                  {m.userId === myUserId ? ' (you)' : ''}
                </td>
                <td className="py-1.5 pr-4">{m.name ?? '—'}</td>
                <td className="py-1.5 pr-4">
                  {canManage ? (
                    <select
                      aria-label={`Role of ${m.login}`}
                      value={m.role}
                      disabled={roleChange.isPending}
                      onChange={(e) =>
                        roleChange.mutate({ member: m, role: e.target.value as TeamRole })
                      }
                      className="rounded border border-rule bg-white px-2 py-0.5"
                    >
                      {teamRoles.map((r) => (
                        <option key={r} value={r}>
                          {r}
                        </option>
                      ))}
                    </select>
                  ) : (
                    m.role
                  )}
                </td>
                <td className="py-1.5 pr-4 text-ink-soft">{formatDateTime(m.joinedAt)}</td>
                {canManage ? (
                  <td className="py-1.5">
                    <button
                      type="button"
                      disabled={removal.isPending}
                      onClick={() => {
                        if (window.confirm(`Remove ${m.login} from the team?`)) removal.mutate(m);
                      }}
                      className="text-beyond underline"
                      aria-label={`Remove ${m.login}`}
                    >
                      Remove
                    </button>
                  </td>
                ) : null}
              </tr>
            ))}
          </tbody>
        </table>
      )}
      {!canManage ? (
        <p className="mt-2 text-sm text-ink-soft">Maintainers change roles and remove members.</p>
      ) : null}
    </Section>
  );
}
