import { useCallback, useEffect, useRef, useState } from 'react';

export type CopyState = 'idle' | 'copied' | 'failed';

const RESET_AFTER_MS = 4000;

/** Copies with the async Clipboard API; where that is refused, selects `fallbackSource` and uses execCommand. */
export function useCopyToClipboard() {
  const [state, setState] = useState<CopyState>('idle');
  const timer = useRef<number | undefined>(undefined);

  useEffect(() => () => window.clearTimeout(timer.current), []);

  const copy = useCallback(async (text: string, fallbackSource?: HTMLInputElement | HTMLTextAreaElement | null) => {
    let copied = false;
    try {
      await navigator.clipboard.writeText(text);
      copied = true;
    } catch {
      if (fallbackSource) {
        fallbackSource.focus();
        fallbackSource.select();
        // Deprecated but still the only path where the Clipboard API is refused (no permission, insecure origin).
        copied = document.execCommand('copy');
      }
    }
    setState(copied ? 'copied' : 'failed');
    window.clearTimeout(timer.current);
    timer.current = window.setTimeout(() => setState('idle'), RESET_AFTER_MS);
    return copied;
  }, []);

  return { state, copy };
}
