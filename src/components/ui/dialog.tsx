import { useEffect, useId, useRef, type FormEvent, type ReactNode } from 'react';
import { cx } from '#src/lib/cx.ts';
import { Button } from './button.tsx';

type DialogProps = {
  open: boolean;
  title: string;
  children: ReactNode;
  onClose(): void;
  /** When given, the dialog asks for confirmation with these buttons. */
  confirm?: { label: string; onConfirm?(): void; danger?: boolean; busy?: boolean };
  /** Makes the dialog a form: Enter or the confirm button submits it. */
  onSubmit?(event: FormEvent<HTMLFormElement>): void;
  wide?: boolean;
};

/**
 * A modal on the native <dialog> element, which brings focus trapping, Escape to close and the
 * inert background with it. With `onSubmit` its body and buttons are one form.
 */
export function Dialog({ open, title, children, onClose, confirm, onSubmit, wide = false }: DialogProps) {
  const ref = useRef<HTMLDialogElement>(null);
  const titleId = useId();
  useEffect(() => {
    const dialog = ref.current;
    if (!dialog) return;
    if (open && !dialog.open) dialog.showModal();
    if (!open && dialog.open) dialog.close();
  }, [open]);
  const body = (
    <>
      <div className="max-h-[70vh] overflow-y-auto p-6">
        <h2 id={titleId} className="mb-3 text-lg font-bold">
          {title}
        </h2>
        <div className="text-sm text-graphite-700">{open && children}</div>
      </div>
      <div className="flex justify-end gap-2 border-t border-graphite-100 bg-birch-50 px-6 py-3">
        <Button variant="secondary" onClick={onClose}>
          {confirm ? 'Cancel' : 'Close'}
        </Button>
        {confirm && (
          <Button
            type={onSubmit ? 'submit' : 'button'}
            variant={confirm.danger ? 'danger' : 'primary'}
            busy={confirm.busy}
            onClick={onSubmit ? undefined : confirm.onConfirm}
          >
            {confirm.label}
          </Button>
        )}
      </div>
    </>
  );
  return (
    <dialog
      ref={ref}
      onClose={onClose}
      aria-labelledby={titleId}
      className={cx(
        'm-auto rounded-card border border-graphite-100 bg-white p-0 text-graphite-900 shadow-xl backdrop:bg-graphite-950/40',
        wide ? 'w-[min(44rem,calc(100vw-2rem))]' : 'w-[min(32rem,calc(100vw-2rem))]',
      )}
    >
      {onSubmit ? (
        <form onSubmit={onSubmit} noValidate>
          {body}
        </form>
      ) : (
        body
      )}
    </dialog>
  );
}
