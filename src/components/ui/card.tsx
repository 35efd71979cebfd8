import type { HTMLAttributes, ReactNode } from 'react';
import { cx } from '#src/lib/cx.ts';

/** A white panel on the birch background. */
export function Card({ className, ...rest }: HTMLAttributes<HTMLDivElement>) {
  return (
    <div
      className={cx('rounded-card border border-graphite-100 bg-white p-6 shadow-[0_1px_2px_rgb(36_33_31/0.06)]', className)}
      {...rest}
    />
  );
}

export function CardTitle({ children, aside }: { children: ReactNode; aside?: ReactNode }) {
  return (
    <div className="mb-4 flex items-center justify-between gap-4">
      <h2 className="text-lg font-bold text-graphite-900">{children}</h2>
      {aside}
    </div>
  );
}
