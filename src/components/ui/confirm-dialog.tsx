import { useEffect, useId, useRef, type ReactNode } from 'react';
import { Button } from './button';

type ConfirmDialogProps = {
  open: boolean;
  title: string;
  children: ReactNode;
  confirmLabel: string;
  /** The safe way out, focused first so Enter never confirms by accident. */
  cancelLabel: string;
  busy?: boolean;
  onConfirm: () => void;
  onCancel: () => void;
};

/**
 * A modal question before something that cannot simply be undone. The browser's own modal
 * `<dialog>` keeps focus inside and closes on Escape; focus goes back where it was on close.
 */
export function ConfirmDialog({ open, title, children, confirmLabel, cancelLabel, busy = false, onConfirm, onCancel }: ConfirmDialogProps) {
  const dialogRef = useRef<HTMLDialogElement>(null);
  const cancelRef = useRef<HTMLButtonElement>(null);
  const titleId = useId();
  const bodyId = useId();

  useEffect(() => {
    const dialog = dialogRef.current;
    if (!dialog || !open) return;
    const returnFocusTo = document.activeElement instanceof HTMLElement ? document.activeElement : null;
    if (!dialog.open) dialog.showModal();
    cancelRef.current?.focus();
    return () => {
      if (dialog.open) dialog.close();
      returnFocusTo?.focus();
    };
  }, [open]);

  return (
    <dialog
      ref={dialogRef}
      aria-labelledby={titleId}
      aria-describedby={bodyId}
      onCancel={(event) => {
        event.preventDefault();
        if (!busy) onCancel();
      }}
      className="m-auto w-[min(32rem,calc(100%-2rem))] rounded-card border border-rule bg-sheet p-6 text-ink shadow-card backdrop:bg-ink/50"
    >
      {open ? (
        <>
          <h2 id={titleId} className="text-h3">
            {title}
          </h2>
          <div id={bodyId} className="mt-2 text-ink">
            {children}
          </div>
          <div className="mt-6 flex flex-wrap justify-end gap-3">
            <Button ref={cancelRef} variant="secondary" onClick={onCancel} disabled={busy}>
              {cancelLabel}
            </Button>
            <Button onClick={onConfirm} disabled={busy}>
              {confirmLabel}
            </Button>
          </div>
        </>
      ) : null}
    </dialog>
  );
}
