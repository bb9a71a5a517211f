import { createContext, useCallback, useContext, useMemo, useRef, useState, type ReactNode } from 'react';
import { cn } from '@console/utils/cn';

type Tone = 'success' | 'info';
type Notice = { id: number; message: string; tone: Tone };
type Notify = (message: string, tone?: Tone) => void;

const NotifyContext = createContext<Notify | null>(null);
const NOTICE_LIFETIME_MS = 6000;

/**
 * Short confirmations ("Key revoked") in one polite live region. The region is always in the page, so
 * assistive technology announces each message as it is added.
 */
export function NotificationsProvider({ children }: { children: ReactNode }) {
  const [notices, setNotices] = useState<Notice[]>([]);
  const nextId = useRef(1);

  const dismiss = useCallback((id: number) => setNotices((current) => current.filter((notice) => notice.id !== id)), []);

  const notify = useCallback<Notify>(
    (message, tone = 'success') => {
      const id = nextId.current++;
      setNotices((current) => [...current.slice(-2), { id, message, tone }]);
      window.setTimeout(() => dismiss(id), NOTICE_LIFETIME_MS);
    },
    [dismiss],
  );

  const value = useMemo(() => notify, [notify]);

  return (
    <NotifyContext.Provider value={value}>
      {children}
      <div
        role="status"
        aria-live="polite"
        className="pointer-events-none fixed right-4 bottom-4 z-50 flex w-[min(24rem,calc(100vw-2rem))] flex-col gap-2"
      >
        {notices.map((notice) => (
          <div
            key={notice.id}
            className={cn(
              'on-ink pointer-events-auto flex items-start justify-between gap-3 rounded-md border-l-4',
              'bg-ink-900 px-4 py-3 text-sm text-white shadow-dialog',
              notice.tone === 'success' ? 'border-ok-600' : 'border-signal-500',
            )}
          >
            <span>{notice.message}</span>
            <button
              type="button"
              onClick={() => dismiss(notice.id)}
              className="rounded-sm px-1 text-ink-300 hover:text-white"
              aria-label="Dismiss message"
            >
              ×
            </button>
          </div>
        ))}
      </div>
    </NotifyContext.Provider>
  );
}

export function useNotify(): Notify {
  const notify = useContext(NotifyContext);
  if (!notify) throw new Error('useNotify must be used inside NotificationsProvider');
  return notify;
}
