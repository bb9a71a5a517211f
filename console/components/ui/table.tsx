import type { ReactNode, TdHTMLAttributes, ThHTMLAttributes } from 'react';
import { cn } from '@console/utils/cn';

/** A plain data table; the caption names it for screen readers and may stay visually hidden. */
export function Table({ caption, captionHidden = true, children }: { caption: string; captionHidden?: boolean; children: ReactNode }) {
  return (
    <div className="relative overflow-x-auto">
      <table className="w-full border-collapse text-left text-sm">
        <caption className={captionHidden ? 'sr-only' : 'px-5 py-3 text-left text-sm font-semibold text-ink-700'}>
          {caption}
        </caption>
        {children}
      </table>
    </div>
  );
}

export function Th({ className, ...rest }: ThHTMLAttributes<HTMLTableCellElement>) {
  return (
    <th
      scope="col"
      className={cn(
        'border-b border-ink-200 bg-ink-50 px-4 py-2.5 font-mono text-eyebrow font-semibold whitespace-nowrap',
        'text-ink-600 uppercase first:pl-5 last:pr-5',
        className,
      )}
      {...rest}
    />
  );
}

export function Td({ className, ...rest }: TdHTMLAttributes<HTMLTableCellElement>) {
  return (
    <td
      className={cn('border-b border-ink-100 px-4 py-3 align-middle text-ink-800 first:pl-5 last:pr-5', className)}
      {...rest}
    />
  );
}
