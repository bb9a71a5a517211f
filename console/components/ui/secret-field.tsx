import { useId, type RefObject } from 'react';
import { useCopyToClipboard } from '@console/hooks/use-copy-to-clipboard';
import { cn } from '@console/utils/cn';
import { Button } from './button';
import { controlClasses } from './field';
import { Icon } from './icons';

/**
 * A secret shown once (API key, webhook signing secret): read-only, selected on focus, with a copy button and a
 * fallback message when the browser blocks the clipboard. `inputRef` lets the dialog focus it when it opens.
 */
export function SecretField({
  label,
  secret,
  inputRef,
  copiedMessage,
  testId,
}: {
  label: string;
  secret: string;
  inputRef: RefObject<HTMLTextAreaElement | null>;
  copiedMessage: string;
  testId: string;
}) {
  const secretId = useId();
  const { state, copy } = useCopyToClipboard();
  const message = state === 'copied' ? copiedMessage : state === 'failed' ? 'Copying was blocked by the browser. Select the secret and press Ctrl+C (⌘C on a Mac).' : '';
  return (
    <div className="space-y-1.5">
      <label htmlFor={secretId} className="text-sm font-semibold text-ink-800">
        {label}
      </label>
      <div className="flex items-start gap-2">
        <textarea
          id={secretId}
          ref={inputRef}
          readOnly
          rows={2}
          value={secret}
          spellCheck={false}
          autoComplete="off"
          onFocus={(event) => event.currentTarget.select()}
          className={cn(controlClasses, 'resize-none py-2 font-mono text-xs leading-5 break-all')}
          data-testid={testId}
        />
        <Button variant="secondary" onClick={() => copy(secret, inputRef.current)}>
          <Icon name={state === 'copied' ? 'check' : 'copy'} className="size-4" />
          {state === 'copied' ? 'Copied' : 'Copy'}
        </Button>
      </div>
      <p role="status" className="min-h-4 text-xs text-ink-600">
        {message}
      </p>
    </div>
  );
}
