import { useState } from 'react';
import { Button } from '#src/components/ui/button.tsx';
import { useToast } from '#src/components/ui/toast.tsx';

/** A table row's Edit and Delete (or Remove) buttons, named for screen readers by the row. */
export function RowActions({
  name,
  onEdit,
  onDelete,
  deleteWord = 'Delete',
  deleteDisabled,
  deleteTitle,
}: {
  name: string;
  onEdit(): void;
  onDelete(): void;
  deleteWord?: string;
  deleteDisabled?: boolean;
  deleteTitle?: string;
}) {
  return (
    <span className="inline-flex gap-1">
      <Button size="sm" variant="quiet" onClick={onEdit} aria-label={`Edit ${name}`}>
        Edit
      </Button>
      <Button
        size="sm"
        variant="quiet"
        onClick={onDelete}
        disabled={deleteDisabled}
        title={deleteTitle}
        aria-label={`${deleteWord} ${name}`}
      >
        {deleteWord}
      </Button>
    </span>
  );
}

/**
 * A deletion that asks first: `ask(row)` opens the dialog, `confirm()` runs it (the list has
 * already dropped the row optimistically) and toasts the outcome.
 */
export function useConfirmedDelete<T>(run: (row: T) => Promise<unknown>, done: (row: T) => string) {
  const [pending, setPending] = useState<T>();
  const toast = useToast();
  return {
    pending,
    ask: setPending,
    cancel: () => setPending(undefined),
    async confirm() {
      const row = pending!;
      setPending(undefined);
      try {
        await run(row);
        toast.show(done(row), 'success');
      } catch (error) {
        toast.show((error as Error).message, 'error');
      }
    },
  };
}
