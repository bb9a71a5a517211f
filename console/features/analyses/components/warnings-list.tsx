import { Alert } from '@console/components/ui/alert';

type Warning = { code: string; message: string };

/** Engine and calibration warnings; the code is shown too, since scripts branch on it. */
export function WarningsList({ warnings }: { warnings: Warning[] }) {
  if (warnings.length === 0) return null;
  return (
    <Alert tone="warning" title={warnings.length === 1 ? '1 warning' : `${warnings.length} warnings`}>
      <ul className="space-y-1">
        {warnings.map((warning, i) => (
          <li key={`${warning.code}-${i}`}>
            <span className="mr-2 font-mono text-xs text-signal-800">{warning.code}</span>
            {warning.message}
          </li>
        ))}
      </ul>
    </Alert>
  );
}
