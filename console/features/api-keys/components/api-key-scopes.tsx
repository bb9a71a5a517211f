import { useState } from 'react';

const VISIBLE_SCOPES = 3;

/** Scope names as chips; long lists fold behind a button that says how many are hidden. */
export function ApiKeyScopes({ scopes }: { scopes: readonly string[] }) {
  const [expanded, setExpanded] = useState(false);
  const shown = expanded ? scopes : scopes.slice(0, VISIBLE_SCOPES);
  const hiddenCount = scopes.length - shown.length;
  return (
    <ul className="flex max-w-72 min-w-48 flex-wrap gap-1">
      {shown.map((scope) => (
        <li key={scope} className="rounded-sm bg-ink-100 px-1.5 py-0.5 font-mono text-[11px] text-ink-800">
          {scope}
        </li>
      ))}
      {(hiddenCount > 0 || expanded) && scopes.length > VISIBLE_SCOPES && (
        <li>
          <button
            type="button"
            aria-expanded={expanded}
            onClick={() => setExpanded((value) => !value)}
            className="rounded-sm px-1.5 py-0.5 text-[11px] font-semibold text-ink-700 underline-offset-2 hover:underline"
          >
            {expanded ? 'Show fewer' : `+${hiddenCount} more`}
          </button>
        </li>
      )}
    </ul>
  );
}
