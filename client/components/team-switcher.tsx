import { useId } from 'react';
import { useNavigate } from 'react-router-dom';
import { paths } from '@client/app/paths.ts';
import type { MeTeam } from '@shared/api/me.ts';

/** Chooses the current team; the choice lives in the address (`/teams/:teamSlug/...`). */
export function TeamSwitcher({ teams, current }: { teams: MeTeam[]; current: MeTeam | undefined }) {
  const navigate = useNavigate();
  const id = useId();
  if (teams.length === 0) return null;
  return (
    <div className="flex items-center gap-2 text-sm">
      <label htmlFor={id} className="text-ink-soft">
        Team
      </label>
      <select
        id={id}
        data-testid="team-switcher"
        value={current?.slug ?? ''}
        onChange={(e) => {
          if (e.target.value) void navigate(paths.team(e.target.value));
        }}
        className="rounded border border-rule bg-paper px-2 py-1 text-ink"
      >
        {current ? null : <option value="">Choose a team…</option>}
        {teams.map((t) => (
          <option key={t.slug} value={t.slug}>
            {t.name}
          </option>
        ))}
      </select>
      {current ? (
        <span
          data-testid="my-role"
          className="rounded border border-rule px-1.5 py-0.5 text-xs text-ink-soft"
          title="Your role in this team"
        >
          {current.role}
        </span>
      ) : null}
    </div>
  );
}
