import { Link } from 'react-router';
import { Badge } from '@console/components/ui/badge';
import { Table, Td, Th } from '@console/components/ui/table';
import { paths } from '@console/config/paths';
import { formatDateTime } from '@console/utils/format-date';
import type { MaskVersion } from '@shared/schemas/masks';
import { maskLevelLabel } from '../utils/mask-chart';

type MaskVersionsListProps = { maskId: string; versions: MaskVersion[]; shownVersion: number; latestVersion: number };

/** Every version, newest first; verdicts name the version they used, so none is ever changed. */
export function MaskVersionsList({ maskId, versions, shownVersion, latestVersion }: MaskVersionsListProps) {
  return (
    <Table caption="Versions of the mask">
      <thead>
        <tr>
          <Th>Version</Th>
          <Th>Levels</Th>
          <Th className="text-right">Points</Th>
          <Th>How</Th>
          <Th>Created</Th>
        </tr>
      </thead>
      <tbody>
        {versions.map((version) => (
          <tr key={version.version} className={version.version === shownVersion ? 'bg-ink-50' : undefined}>
            <Td>
              <div className="flex items-center gap-2">
                {version.version === shownVersion ? (
                  <span className="font-semibold" aria-current="true">
                    v{version.version} <span className="text-xs font-normal text-ink-600">(shown)</span>
                  </span>
                ) : (
                  <Link to={paths.app.mask.getHref(maskId, version.version)} className="font-semibold underline underline-offset-2" aria-label={`Show version ${version.version}`}>
                    v{version.version}
                  </Link>
                )}
                {version.version === latestVersion && <Badge tone="accent">Current</Badge>}
              </div>
            </Td>
            <Td className="text-xs">{maskLevelLabel(version).replace(/^Level \((.*)\)$/, '$1')}</Td>
            <Td className="text-right font-mono tabular">{version.upper?.length ?? version.lower?.length ?? 0}</Td>
            <Td className="text-xs">
              {version.derivation ? `Derived: k = ${version.derivation.k}, min ±${version.derivation.minHalfWidthDb} dB, ${version.derivation.curveCount} units` : 'Entered points'}
              {version.note && <div className="text-ink-600">{version.note}</div>}
            </Td>
            <Td className="whitespace-nowrap">
              <time dateTime={version.createdAt}>{formatDateTime(version.createdAt)}</time>
            </Td>
          </tr>
        ))}
      </tbody>
    </Table>
  );
}
