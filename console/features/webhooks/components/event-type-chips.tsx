/** Subscribed event types as chips. */
export function EventTypeChips({ eventTypes }: { eventTypes: readonly string[] }) {
  return (
    <ul className="flex flex-wrap gap-1">
      {eventTypes.map((eventType) => (
        <li key={eventType} className="rounded-sm bg-ink-100 px-1.5 py-0.5 font-mono text-[11px] text-ink-800">
          {eventType}
        </li>
      ))}
    </ul>
  );
}
