import { cn } from '@console/utils/cn';
import { WEBHOOK_EVENT_CHOICES } from '../utils/event-types';

type EventTypeCheckboxesProps = {
  selected: ReadonlySet<string>;
  onToggle: (name: string, checked: boolean) => void;
  error?: string;
};

/** One checkbox per event type, in a fieldset whose legend names the choice. */
export function EventTypeCheckboxes({ selected, onToggle, error }: EventTypeCheckboxesProps) {
  return (
    <fieldset aria-describedby={error ? 'event-types-error' : 'event-types-hint'} className="space-y-3">
      <legend className="text-sm font-semibold text-ink-800">Events</legend>
      <p id="event-types-hint" className="text-xs text-ink-500">
        The receiver gets a signed POST for each event you pick.
      </p>
      <ul className="grid gap-2 md:grid-cols-3">
        {WEBHOOK_EVENT_CHOICES.map((choice) => {
          const checked = selected.has(choice.name);
          return (
            <li key={choice.name}>
              <label
                className={cn(
                  'flex h-full cursor-pointer items-start gap-3 rounded-md border px-3 py-2.5 transition-colors',
                  checked ? 'border-ink-600 bg-ink-50' : 'border-ink-200 hover:border-ink-400',
                )}
              >
                <input
                  type="checkbox"
                  name="eventTypes"
                  value={choice.name}
                  checked={checked}
                  onChange={(event) => onToggle(choice.name, event.target.checked)}
                  className="mt-0.5 size-4 shrink-0 accent-ink-700"
                />
                <span className="min-w-0">
                  <span className="block font-mono text-xs font-semibold text-ink-900">{choice.name}</span>
                  <span className="block text-xs text-ink-600">{choice.description}</span>
                </span>
              </label>
            </li>
          );
        })}
      </ul>
      {error && (
        <p id="event-types-error" className="text-xs font-semibold text-danger-700">
          {error}
        </p>
      )}
    </fieldset>
  );
}
