import { useEffect, useRef, type ReactNode } from 'react';
import { Button } from './button.tsx';

type DialogProps = {
  open: boolean;
  title: string;
  children: ReactNode;
  onClose(): void;
  /** When given, the dialog asks for confirmation with these buttons. */
  confirm?: { label: string; onConfirm(): void; danger?: boolean; busy?: boolean };
};

/**
 * A modal on the native <dialog> element, which brings focus trapping, Escape to close and the
 * inert background with it.
 */
export function Dialog({ open, title, children, onClose, confirm }: DialogProps) {
  const ref = useRef<HTMLDialogElement>(null);
  useEffect(() => {
    const dialog = ref.current;
    if (!dialog) return;
    if (open && !dialog.open) dialog.showModal();
    if (!open && dialog.open) dialog.close();
  }, [open]);
  return (
    <dialog
      ref={ref}
      onClose={onClose}
      aria-labelledby="dialog-title"
      className="m-auto w-[min(32rem,calc(100vw-2rem))] rounded-card border border-graphite-100 bg-white p-0 text-graphite-900 shadow-xl backdrop:bg-graphite-950/40"
    >
      <div className="p-6">
        <h2 id="dialog-title" className="mb-3 text-lg font-bold">
          {title}
        </h2>
        <div className="text-sm text-graphite-700">{children}</div>
      </div>
      <div className="flex justify-end gap-2 border-t border-graphite-100 bg-birch-50 px-6 py-3">
        <Button variant="secondary" onClick={onClose}>
          {confirm ? 'Cancel' : 'Close'}
        </Button>
        {confirm && (
          <Button variant={confirm.danger ? 'danger' : 'primary'} busy={confirm.busy} onClick={confirm.onConfirm}>
            {confirm.label}
          </Button>
        )}
      </div>
    </dialog>
  );
}
