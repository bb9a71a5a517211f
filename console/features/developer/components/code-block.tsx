import { useId, useRef } from 'react';
import { Icon } from '@console/components/ui/icons';
import { useCopyToClipboard } from '@console/hooks/use-copy-to-clipboard';
import { cn } from '@console/utils/cn';
import { downloadText } from '../utils/download-text';

type CodeBlockProps = {
  code: string;
  /** Names the block for screen readers and the copy button ("Copy curl example"). */
  label: string;
  /** Offers a download of the text under this file name. */
  fileName?: string;
  className?: string;
  maxHeightClass?: string;
};

// The dark header needs light buttons; the shared Button variants are drawn for the paper surface.
const inkButton =
  'inline-flex h-7 items-center gap-1.5 rounded-md px-2.5 text-xs font-semibold text-ink-200 transition-colors hover:bg-ink-800 hover:text-white';

const copyMessages = { idle: '', copied: 'Copied to the clipboard.', failed: 'Copying was blocked; select the text and press Ctrl+C.' } as const;

/** Read-only code on the dark surface, scrollable with the keyboard, with copy (and optional download) buttons. */
export function CodeBlock({ code, label, fileName, className, maxHeightClass = 'max-h-80' }: CodeBlockProps) {
  const { state, copy } = useCopyToClipboard();
  const fallbackRef = useRef<HTMLTextAreaElement>(null);
  const statusId = useId();
  return (
    <div className={cn('space-y-1.5', className)}>
      <div className="on-ink overflow-hidden rounded-md border border-ink-800 bg-ink-950">
        <div className="flex items-center justify-between gap-2 border-b border-ink-800 px-3 py-1.5">
          <span className="font-mono text-[11px] text-ink-400">{fileName ?? label}</span>
          <div className="flex gap-1">
            {fileName && (
              <button type="button" className={inkButton} aria-label={`Download ${fileName}`} onClick={() => downloadText(fileName, code)}>
                Download
              </button>
            )}
            <button
              type="button"
              className={inkButton}
              aria-label={`Copy ${label}`}
              aria-describedby={statusId}
              onClick={() => copy(code, fallbackRef.current)}
            >
              <Icon name={state === 'copied' ? 'check' : 'copy'} className="size-4" />
              {state === 'copied' ? 'Copied' : 'Copy'}
            </button>
          </div>
        </div>
        {/* tabIndex: a scrollable region must be reachable with the keyboard to be scrolled with it. */}
        <pre
          tabIndex={0}
          role="region"
          aria-label={label}
          className={cn(
            'overflow-auto px-4 py-3 font-mono text-xs leading-5 text-ink-100 focus-visible:[outline-offset:-2px]',
            maxHeightClass,
          )}
        >
          <code>{code}</code>
        </pre>
      </div>
      <textarea ref={fallbackRef} readOnly value={code} tabIndex={-1} aria-hidden="true" className="sr-only" />
      <p id={statusId} role="status" className="min-h-4 text-xs text-ink-600">
        {copyMessages[state]}
      </p>
    </div>
  );
}
