import { Link } from 'react-router';
import { Button } from '@console/components/ui/button';
import { EmptyState, ErrorState, LoadingState } from '@console/components/ui/states';
import { Table, Td, Th } from '@console/components/ui/table';
import { paths } from '@console/config/paths';
import { formatDateTime } from '@console/utils/format-date';
import { useMasks } from '../api/get-masks';

/** `canCreate`: whether the empty state may point at the create forms below (roles without masks:write see none). */
export function MasksTable({ canCreate }: { canCreate: boolean }) {
  const masks = useMasks();
  if (masks.isPending) return <LoadingState label="Loading masks…" />;
  if (masks.isError) return <ErrorState error={masks.error} onRetry={() => masks.refetch()} />;
  const rows = masks.data.pages.flatMap((page) => page.data);
  if (rows.length === 0) {
    return (
      <EmptyState title="No masks yet">
        {canCreate ? 'Create one from points below, or derive one from golden units.' : 'Masks appear here once an analyst, admin or owner creates one.'}
      </EmptyState>
    );
  }
  return (
    <>
      <Table caption="Tolerance masks">
        <thead>
          <tr>
            <Th>Mask</Th>
            <Th className="text-right">Versions</Th>
            <Th>Changed</Th>
            <Th>Created</Th>
          </tr>
        </thead>
        <tbody>
          {rows.map((mask) => (
            <tr key={mask.id}>
              <Td>
                <Link to={paths.app.mask.getHref(mask.id)} className="font-semibold text-ink-900 underline-offset-2 hover:underline">
                  {mask.name}
                </Link>
                <div className="font-mono text-xs text-ink-500">{mask.id}</div>
              </Td>
              <Td className="text-right font-mono tabular">{mask.latestVersion}</Td>
              <Td className="whitespace-nowrap">
                <time dateTime={mask.updatedAt}>{formatDateTime(mask.updatedAt)}</time>
              </Td>
              <Td className="whitespace-nowrap">
                <time dateTime={mask.createdAt}>{formatDateTime(mask.createdAt)}</time>
              </Td>
            </tr>
          ))}
        </tbody>
      </Table>
      {masks.hasNextPage && (
        <div className="px-5 py-3">
          <Button variant="secondary" size="sm" isPending={masks.isFetchingNextPage} onClick={() => masks.fetchNextPage()}>
            Load older masks
          </Button>
        </div>
      )}
    </>
  );
}
