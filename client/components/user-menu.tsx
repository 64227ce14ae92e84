import { useSignOut } from '@client/features/auth/use-sign-out.ts';
import type { MeUser } from '@shared/api/me.ts';
import { Avatar } from './avatar.tsx';

/** The signed-in person, and the way out. */
export function UserMenu({ user }: { user: MeUser }) {
  const signOut = useSignOut();
  return (
    <div className="flex items-center gap-2 text-sm" data-testid="signed-in-as">
      <Avatar login={user.login} name={user.name} />
      <span className="flex flex-col leading-tight">
        <span className="font-medium">{user.name ?? user.login}</span>
        <span className="font-mono text-xs text-ink-soft">
          {user.login}
          {user.isAdmin ? ' · admin' : ''}
        </span>
      </span>
      <button
        type="button"
        onClick={() => signOut.mutate()}
        disabled={signOut.isPending}
        className="ml-2 rounded border border-ink/30 px-2 py-1 text-xs hover:bg-paper-deep disabled:opacity-60"
      >
        Sign out
      </button>
    </div>
  );
}
