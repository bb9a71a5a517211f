import { Icon } from '@console/components/ui/icons';
import { cn } from '@console/utils/cn';
import { roleLabel } from '@console/utils/roles';
import type { Session } from '@shared/schemas/auth';
import { useSignOut } from '../api/sign-out';

export function AccountPanel({ session, onSignedOut }: { session: Session; onSignedOut: () => void }) {
  const signOut = useSignOut({ onSettled: onSignedOut });
  return (
    <div className="space-y-3">
      <div className="min-w-0 space-y-0.5">
        <p className="truncate text-sm font-bold text-white">{session.user.displayName}</p>
        <p className="truncate text-xs text-ink-300" title={session.user.email}>
          {session.user.email}
        </p>
      </div>
      <div className="flex items-center justify-between gap-3">
        <p className="font-mono text-eyebrow text-signal-300 uppercase">
          <span className="sr-only">Role: </span>
          {roleLabel(session.activeOrganisation.role)}
        </p>
        <button
          type="button"
          onClick={() => signOut.mutate()}
          disabled={signOut.isPending}
          className={cn(
            'inline-flex items-center gap-1.5 rounded-md border border-ink-700 px-2.5 py-1.5 text-xs font-semibold',
            'text-ink-200 hover:border-ink-500 hover:text-white disabled:opacity-60',
          )}
        >
          <Icon name="signOut" className="size-4" />
          Sign out
        </button>
      </div>
    </div>
  );
}
