import { Panel } from '@console/components/ui/panel';
import { conventionLines } from '../utils/conventions-words';

/** Every convention the result used, in words, so nothing about the numbers has to be guessed. */
export function ConventionsBlock({ conventions }: { conventions: Record<string, string | number | undefined> }) {
  const lines = conventionLines(conventions);
  if (lines.length === 0) return null;
  return (
    <Panel title="Conventions" description="How the numbers above were obtained and what they are relative to.">
      <dl className="grid gap-x-6 gap-y-3 text-sm md:grid-cols-[12rem_minmax(0,1fr)]">
        {lines.map((line) => (
          <div key={line.key} className="contents">
            <dt className="font-semibold text-ink-700">{line.label}</dt>
            <dd className="text-ink-800 [overflow-wrap:anywhere]">{line.text}</dd>
          </div>
        ))}
      </dl>
    </Panel>
  );
}
