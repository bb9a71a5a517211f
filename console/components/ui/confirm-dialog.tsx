import type { ReactNode } from 'react';
import { Button } from './button';
import { Dialog } from './dialog';
import { ProblemAlert } from './alert';

type ConfirmDialogProps = {
  open: boolean;
  title: ReactNode;
  description: ReactNode;
  confirmLabel: string;
  onConfirm: () => void;
  onCancel: () => void;
  isPending?: boolean;
  error?: unknown;
  tone?: 'danger' | 'primary';
};

/** A yes/no question before something that cannot be undone; Cancel comes first and takes focus. */
export function ConfirmDialog({
  open,
  title,
  description,
  confirmLabel,
  onConfirm,
  onCancel,
  isPending,
  error,
  tone = 'danger',
}: ConfirmDialogProps) {
  return (
    <Dialog
      open={open}
      onClose={onCancel}
      title={title}
      description={description}
      dismissible={!isPending}
      footer={
        <>
          <Button variant="secondary" onClick={onCancel} disabled={isPending}>
            Cancel
          </Button>
          <Button variant={tone} onClick={onConfirm} isPending={isPending}>
            {confirmLabel}
          </Button>
        </>
      }
    >
      {error ? <ProblemAlert error={error} /> : null}
    </Dialog>
  );
}
