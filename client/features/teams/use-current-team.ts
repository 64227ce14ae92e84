import { useQuery } from '@tanstack/react-query';
import { useParams } from 'react-router-dom';
import { meQueries } from '@client/features/auth/me.queries.ts';
import type { MeTeam, MeUser } from '@shared/api/me.ts';

export interface CurrentTeam {
  /** `:teamSlug` from the address ('' outside a team's pages). */
  teamSlug: string;
  /** The team with the person's role in it; undefined while loading or when not a member. */
  team: MeTeam | undefined;
  /** The signed-in person; null when signed out, undefined while loading. */
  user: MeUser | null | undefined;
  isPending: boolean;
  error: Error | null;
}

/** The team named by `/teams/:teamSlug/...`, looked up in the signed-in person's teams. */
export function useCurrentTeam(): CurrentTeam {
  const { teamSlug = '' } = useParams();
  const me = useQuery(meQueries.current());
  return {
    teamSlug,
    team: me.data?.teams.find((t) => t.slug === teamSlug),
    user: me.data === undefined ? undefined : (me.data?.user ?? null),
    isPending: me.isPending,
    error: me.error,
  };
}
