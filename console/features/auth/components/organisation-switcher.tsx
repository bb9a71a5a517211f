import { useId } from 'react';
import { Spinner } from '@console/components/ui/spinner';
import { describeProblem } from '@console/lib/problem-message';
import { cn } from '@console/utils/cn';
import type { Session } from '@shared/schemas/auth';
import { useSwitchOrganisation } from '../api/switch-organisation';

/** Lists the organisations of this person; picking one makes it active and refreshes every screen. */
const problemText = (error: unknown) => {
  const message = describeProblem(error);
  return message.detail ?? message.title;
};

type OrganisationSwitcherProps = { session: Session; onSwitched?: (session: Session) => void };

export function OrganisationSwitcher({ session, onSwitched }: OrganisationSwitcherProps) {
  const id = useId();
  const switcher = useSwitchOrganisation({ onSuccess: onSwitched });
  const active = session.activeOrganisation;

  return (
    <div className="space-y-1.5">
      <label htmlFor={id} className="block px-0.5 font-mono text-eyebrow font-semibold text-ink-400 uppercase">
        Organisation
      </label>
      {session.memberships.length > 1 ? (
        <select
          id={id}
          value={active.id}
          disabled={switcher.isPending}
          onChange={(event) => switcher.mutate(event.target.value)}
          className={cn(
            'block h-10 w-full rounded-md border border-ink-600 bg-ink-900 px-3 text-sm font-semibold text-white',
            'hover:border-ink-500 disabled:opacity-60',
          )}
        >
          {session.memberships.map((membership) => (
            <option key={membership.organisationId} value={membership.organisationId}>
              {membership.organisationName}
            </option>
          ))}
        </select>
      ) : (
        <p
          id={id}
          className="truncate rounded-md border border-ink-800 bg-ink-900 px-3 py-2 text-sm font-semibold text-white"
        >
          {active.name}
        </p>
      )}
      <p role="status" className="min-h-4 px-0.5 text-xs text-ink-300">
        {switcher.isPending && (
          <span className="inline-flex items-center gap-1.5">
            <Spinner className="size-3" /> Switching organisation…
          </span>
        )}
        {switcher.error && <span className="text-signal-300">{problemText(switcher.error)}</span>}
      </p>
    </div>
  );
}
