import { useEffect, useId, useRef, type ReactNode, type RefObject } from 'react';
import { cn } from '@console/utils/cn';

type DialogProps = {
  open: boolean;
  onClose: () => void;
  title: ReactNode;
  description?: ReactNode;
  children?: ReactNode;
  footer?: ReactNode;
  /** Set false while a request runs, so Esc or a backdrop click cannot drop its answer. */
  dismissible?: boolean;
  /** Set false where a stray click must not close it (a secret shown once); Esc still closes. */
  closeOnBackdropClick?: boolean;
  className?: string;
  /** Where focus starts; otherwise the first focusable element inside. */
  initialFocusRef?: RefObject<HTMLElement | null>;
};

/**
 * A modal built on the native <dialog>: showModal() makes the page behind inert (focus stays inside),
 * Esc closes it, and focus goes back to whatever opened it.
 */
export function Dialog({
  open,
  onClose,
  title,
  description,
  children,
  footer,
  dismissible = true,
  closeOnBackdropClick = true,
  className,
  initialFocusRef,
}: DialogProps) {
  const dialogRef = useRef<HTMLDialogElement>(null);
  const openerRef = useRef<Element | null>(null);
  const titleId = useId();
  const descriptionId = useId();

  useEffect(() => {
    const dialog = dialogRef.current;
    if (!dialog) return;
    if (open && !dialog.open) {
      openerRef.current = document.activeElement;
      dialog.showModal();
      initialFocusRef?.current?.focus();
    } else if (!open && dialog.open) {
      dialog.close();
    }
  }, [open, initialFocusRef]);

  useEffect(() => {
    const dialog = dialogRef.current;
    return () => {
      if (dialog?.open) dialog.close();
    };
  }, []);

  const restoreFocus = () => {
    const opener = openerRef.current;
    openerRef.current = null;
    if (opener instanceof HTMLElement && opener.isConnected) opener.focus();
  };

  return (
    <dialog
      ref={dialogRef}
      aria-labelledby={titleId}
      aria-describedby={description ? descriptionId : undefined}
      onCancel={(event) => {
        event.preventDefault();
        if (dismissible) onClose();
      }}
      onClose={restoreFocus}
      onClick={(event) => {
        if (dismissible && closeOnBackdropClick && event.target === dialogRef.current) onClose();
      }}
      className={cn(
        'm-auto w-[min(34rem,calc(100vw-2rem))] rounded-lg border border-ink-200 bg-surface p-0 text-ink-900 shadow-dialog',
        className,
      )}
    >
      {open && (
        <div className="flex flex-col">
          <div className="h-1 rounded-t-lg sweep-rule" aria-hidden="true" />
          <div className="space-y-4 px-6 pt-5 pb-6">
            <header className="space-y-1.5">
              <h2 id={titleId} className="text-lg font-bold text-ink-900">
                {title}
              </h2>
              {description && (
                <div id={descriptionId} className="text-sm text-ink-600">
                  {description}
                </div>
              )}
            </header>
            {children}
          </div>
          {footer && (
            <footer className="flex flex-wrap justify-end gap-2 rounded-b-lg border-t border-ink-100 bg-ink-50 px-6 py-3">
              {footer}
            </footer>
          )}
        </div>
      )}
    </dialog>
  );
}
