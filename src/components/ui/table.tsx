import type { HTMLAttributes, TableHTMLAttributes, TdHTMLAttributes, ThHTMLAttributes } from 'react';
import { cx } from '#src/lib/cx.ts';

/** Table parts with the design system's spacing and rules; use real <table> semantics. */
export function Table({ className, ...rest }: TableHTMLAttributes<HTMLTableElement>) {
  return (
    <div className="relative overflow-x-auto rounded-card border border-graphite-100 bg-white">
      <table className={cx('w-full border-collapse text-left text-sm', className)} {...rest} />
    </div>
  );
}
export function THead(props: HTMLAttributes<HTMLTableSectionElement>) {
  return <thead className="bg-birch-100 text-xs uppercase tracking-wide text-graphite-600" {...props} />;
}
export function TBody(props: HTMLAttributes<HTMLTableSectionElement>) {
  return <tbody className="divide-y divide-graphite-100" {...props} />;
}
export function TR({ className, ...rest }: HTMLAttributes<HTMLTableRowElement>) {
  return <tr className={cx('hover:bg-birch-50', className)} {...rest} />;
}
export function TH({ className, ...rest }: ThHTMLAttributes<HTMLTableCellElement>) {
  return <th scope="col" className={cx('px-4 py-2.5 font-bold', className)} {...rest} />;
}
export function TD({ className, ...rest }: TdHTMLAttributes<HTMLTableCellElement>) {
  return <td className={cx('px-4 py-3 align-middle text-graphite-800', className)} {...rest} />;
}

/** The header of a row-actions column: named for screen readers, empty on screen. */
export function THActions() {
  return (
    <TH className="text-right">
      <span className="sr-only">Actions</span>
    </TH>
  );
}
