import { useId, useRef, useState, type KeyboardEvent } from 'react';
import { cn } from '@console/utils/cn';
import type { RigExample } from '../utils/rig-examples';
import { CodeBlock } from './code-block';

/** One tab per language (WAI-ARIA tabs pattern: arrow keys move between tabs, Home and End jump to the ends). */
export function RigExampleTabs({ examples }: { examples: RigExample[] }) {
  const [selectedIndex, setSelectedIndex] = useState(0);
  const tabRefs = useRef<Array<HTMLButtonElement | null>>([]);
  const baseId = useId();
  const selected = examples[selectedIndex];

  const select = (index: number) => {
    const next = (index + examples.length) % examples.length;
    setSelectedIndex(next);
    tabRefs.current[next]?.focus();
  };

  const onKeyDown = (event: KeyboardEvent<HTMLButtonElement>) => {
    const moves: Record<string, number> = { ArrowRight: selectedIndex + 1, ArrowLeft: selectedIndex - 1, Home: 0, End: examples.length - 1 };
    if (event.key in moves) {
      event.preventDefault();
      select(moves[event.key]);
    }
  };

  return (
    <div className="space-y-4">
      <div role="tablist" aria-label="Rig example language" className="flex gap-1 border-b border-ink-200">
        {examples.map((example, index) => {
          const isSelected = index === selectedIndex;
          return (
            <button
              key={example.id}
              ref={(element) => {
                tabRefs.current[index] = element;
              }}
              type="button"
              role="tab"
              id={`${baseId}-tab-${example.id}`}
              aria-selected={isSelected}
              aria-controls={`${baseId}-panel-${example.id}`}
              tabIndex={isSelected ? 0 : -1}
              onClick={() => setSelectedIndex(index)}
              onKeyDown={onKeyDown}
              className={cn(
                '-mb-px border-b-2 px-3 py-2 text-sm font-semibold transition-colors',
                isSelected ? 'border-signal-600 text-ink-900' : 'border-transparent text-ink-600 hover:text-ink-900',
              )}
            >
              {example.label}
            </button>
          );
        })}
      </div>
      <div role="tabpanel" id={`${baseId}-panel-${selected.id}`} aria-labelledby={`${baseId}-tab-${selected.id}`} className="space-y-3">
        <dl className="grid gap-x-6 gap-y-2 text-sm sm:grid-cols-[auto_minmax(0,1fr)]">
          <dt className="font-semibold text-ink-800">Run</dt>
          <dd className="font-mono text-xs text-ink-800">{selected.runs}</dd>
          <dt className="font-semibold text-ink-800">Needs</dt>
          <dd className="text-ink-700">{selected.needs}</dd>
        </dl>
        <CodeBlock key={selected.id} code={selected.source} label={`${selected.label} rig example`} fileName={selected.fileName} maxHeightClass="max-h-[28rem]" />
      </div>
    </div>
  );
}
