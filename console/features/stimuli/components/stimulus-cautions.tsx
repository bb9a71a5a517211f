import { Alert } from '@console/components/ui/alert';

/** The API's cautions for this signal, beside its download, headed by who decides: the lab and local rules. */
export function StimulusCautions({ cautions }: { cautions: readonly string[] }) {
  return (
    <Alert tone="warning" title="Before you play this signal">
      <ul className="list-disc space-y-1 pl-4" aria-label="Safety cautions">
        {cautions.map((caution) => (
          <li key={caution}>{caution}</li>
        ))}
      </ul>
      <p className="mt-2 font-semibold">
        Local codes and your lab’s licensed practice come first.
      </p>
    </Alert>
  );
}
