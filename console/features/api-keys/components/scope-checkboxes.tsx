import { cn } from '@console/utils/cn';

type Scope = { name: string; description: string };

type ScopeCheckboxesProps = {
  scopes: Scope[];
  selected: ReadonlySet<string>;
  onToggle: (name: string, checked: boolean) => void;
  onSetAll: (names: string[]) => void;
  error?: string;
};

const linkButton = 'font-semibold text-ink-700 underline-offset-2 hover:underline';

/** One checkbox per scope, grouped in a fieldset so the legend names the whole choice. */
export function ScopeCheckboxes({ scopes, selected, onToggle, onSetAll, error }: ScopeCheckboxesProps) {
  const readOnly = scopes.filter((scope) => scope.name.endsWith(':read')).map((scope) => scope.name);
  return (
    <fieldset aria-describedby={error ? 'scopes-error' : 'scopes-hint'} className="space-y-3">
      <legend className="text-sm font-semibold text-ink-800">Scopes</legend>
      <div className="flex flex-wrap items-center gap-x-4 gap-y-1 text-xs">
        <p id="scopes-hint" className="text-ink-500">
          Grant only what the rig or job needs. You can offer only permissions your own role holds.
        </p>
        <div className="flex gap-3">
          <button type="button" className={linkButton} onClick={() => onSetAll(scopes.map((scope) => scope.name))}>
            Select all
          </button>
          <button type="button" className={linkButton} onClick={() => onSetAll(readOnly)}>
            Read only
          </button>
          <button type="button" className={linkButton} onClick={() => onSetAll([])}>
            Clear
          </button>
        </div>
      </div>
      <ul className="grid gap-2 sm:grid-cols-2">
        {scopes.map((scope) => {
          const checked = selected.has(scope.name);
          return (
            <li key={scope.name}>
              <label
                className={cn(
                  'flex cursor-pointer items-start gap-3 rounded-md border px-3 py-2.5 transition-colors',
                  checked ? 'border-ink-600 bg-ink-50' : 'border-ink-200 hover:border-ink-400',
                )}
              >
                <input
                  type="checkbox"
                  name="scopes"
                  value={scope.name}
                  checked={checked}
                  onChange={(event) => onToggle(scope.name, event.target.checked)}
                  className="mt-0.5 size-4 shrink-0 accent-ink-700"
                />
                <span className="min-w-0">
                  <span className="block font-mono text-xs font-semibold text-ink-900">{scope.name}</span>
                  <span className="block text-xs text-ink-600">{scope.description}</span>
                </span>
              </label>
            </li>
          );
        })}
      </ul>
      {error && (
        <p id="scopes-error" className="text-xs font-semibold text-danger-700">
          {error}
        </p>
      )}
    </fieldset>
  );
}
