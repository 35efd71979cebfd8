import type { ReactNode } from 'react';
import { cx } from '#src/lib/cx.ts';

const tones = {
  info: 'border-graphite-200 bg-white text-graphite-800',
  caution: 'border-ember-300 bg-ember-50 text-ember-800',
  error: 'border-rust-600 bg-rust-100 text-rust-800',
} as const;

/** A message block inside a page: information, a caution, or an error. */
export function Notice({ tone = 'info', title, children }: { tone?: keyof typeof tones; title?: string; children: ReactNode }) {
  return (
    <div role={tone === 'error' ? 'alert' : undefined} className={cx('rounded-lg border px-4 py-3 text-sm', tones[tone])}>
      {title && <p className="mb-1 font-bold">{title}</p>}
      <div>{children}</div>
    </div>
  );
}
