import type { BlankStatus } from '#shared/schemas/catalog.ts';
import { cx } from '#src/lib/cx.ts';
import { STATUS_LABELS } from '../labels.ts';

const tones: Record<BlankStatus, string> = {
  draft: 'bg-graphite-100 text-graphite-700',
  active: 'bg-moss-100 text-moss-800',
  archived: 'bg-birch-200 text-graphite-600',
};

/** A blank's status; one on sale without sizes is flagged, since buyers cannot see it. */
export function StatusPill({ status, sizes }: { status: BlankStatus; sizes: number }) {
  return (
    <span className="inline-flex items-center gap-2">
      <span className={cx('rounded-full px-2.5 py-0.5 text-xs font-bold', tones[status])}>{STATUS_LABELS[status]}</span>
      {status === 'active' && sizes === 0 && <span className="text-xs font-semibold text-rust-600">no sizes: hidden</span>}
    </span>
  );
}
