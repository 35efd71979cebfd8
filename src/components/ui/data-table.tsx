import { useId, useState, type ReactNode } from 'react';
import {
  columnFilteringFeature,
  createColumnHelper,
  createFilteredRowModel,
  createSortedRowModel,
  filterFn_equalsString,
  filterFn_includesString,
  globalFilteringFeature,
  rowSortingFeature,
  sortFn_alphanumeric,
  sortFn_basic,
  sortFn_text,
  tableFeatures,
  useTable,
  type ColumnDef,
  type ColumnFiltersState,
  type RowData,
  type SortingState,
} from '@tanstack/react-table';
import { cx } from '#src/lib/cx.ts';
import { controlClasses } from './field.tsx';

/**
 * The workspace's lists: TanStack Table for sorting, a search box over every text column, and
 * optional filters by a column's exact value. Markup and accessibility are ours: real table
 * semantics, sortable headers as buttons with aria-sort.
 */
export const dataTableFeatures = tableFeatures({
  rowSortingFeature,
  columnFilteringFeature,
  globalFilteringFeature,
  filteredRowModel: createFilteredRowModel(),
  sortedRowModel: createSortedRowModel(),
  sortFns: { alphanumeric: sortFn_alphanumeric, text: sortFn_text, basic: sortFn_basic },
  filterFns: { includesString: filterFn_includesString, equalsString: filterFn_equalsString },
});
type Features = typeof dataTableFeatures;

/** Column helper for DataTable columns of rows of type T. */
export const tableColumns = <T extends RowData>() => createColumnHelper<Features, T>();
// Columns of different value types share one list, as TanStack's own examples type them.
// eslint-disable-next-line @typescript-eslint/no-explicit-any
export type DataColumn<T extends RowData> = ColumnDef<Features, T, any>;

export type TableFilter = { columnId: string; label: string; options: ReadonlyArray<{ value: string; label: string }> };

type DataTableProps<T extends RowData> = {
  data: T[];
  columns: DataColumn<T>[];
  getRowId(row: T): string;
  searchLabel: string;
  filters?: TableFilter[];
  initialSorting?: SortingState;
  empty: ReactNode;
  /** Names the table for screen readers. */
  caption: string;
};

export function DataTable<T extends RowData>({
  data,
  columns,
  getRowId,
  searchLabel,
  filters = [],
  initialSorting = [],
  empty,
  caption,
}: DataTableProps<T>) {
  const [sorting, setSorting] = useState<SortingState>(initialSorting);
  const [columnFilters, setColumnFilters] = useState<ColumnFiltersState>([]);
  const [globalFilter, setGlobalFilter] = useState('');
  const id = useId();
  const table = useTable({
    features: dataTableFeatures,
    columns,
    data,
    getRowId,
    state: { sorting, columnFilters, globalFilter },
    onSortingChange: setSorting,
    onColumnFiltersChange: setColumnFilters,
    onGlobalFilterChange: setGlobalFilter,
    globalFilterFn: 'includesString',
    getColumnCanGlobalFilter: (column) => column.id !== 'actions',
  });
  const rows = table.getRowModel().rows;
  const filterValue = (columnId: string) => (columnFilters.find((f) => f.id === columnId)?.value as string | undefined) ?? '';

  return (
    <div className="flex flex-col gap-3">
      <div className="flex flex-wrap items-end gap-3">
        <div className="flex min-w-64 flex-1 flex-col gap-1.5">
          <label htmlFor={`${id}-search`} className="text-sm font-semibold text-graphite-800">
            {searchLabel}
          </label>
          <input
            id={`${id}-search`}
            type="search"
            value={globalFilter}
            onChange={(e) => setGlobalFilter(e.target.value)}
            className={cx(controlClasses(), 'h-10')}
          />
        </div>
        {filters.map((filter) => (
          <div key={filter.columnId} className="flex flex-col gap-1.5">
            <label htmlFor={`${id}-${filter.columnId}`} className="text-sm font-semibold text-graphite-800">
              {filter.label}
            </label>
            <select
              id={`${id}-${filter.columnId}`}
              value={filterValue(filter.columnId)}
              onChange={(e) => table.getColumn(filter.columnId)?.setFilterValue(e.target.value || undefined)}
              className={cx(controlClasses(), 'h-10')}
            >
              <option value="">All</option>
              {filter.options.map((o) => (
                <option key={o.value} value={o.value}>
                  {o.label}
                </option>
              ))}
            </select>
          </div>
        ))}
      </div>
      <div className="relative overflow-x-auto rounded-card border border-graphite-100 bg-white">
        <table className="w-full border-collapse text-left text-sm">
          <caption className="sr-only">{caption}</caption>
          <thead className="bg-birch-100 text-xs uppercase tracking-wide text-graphite-600">
            {table.getHeaderGroups().map((group) => (
              <tr key={group.id}>
                {group.headers.map((header) => {
                  const sorted = header.column.getIsSorted();
                  const canSort = header.column.getCanSort();
                  const content = header.isPlaceholder ? null : <table.FlexRender header={header} />;
                  return (
                    <th
                      key={header.id}
                      scope="col"
                      aria-sort={sorted === 'asc' ? 'ascending' : sorted === 'desc' ? 'descending' : canSort ? 'none' : undefined}
                      className={cx('px-4 py-2.5 font-bold', header.column.id === 'actions' && 'text-right')}
                    >
                      {canSort ? (
                        <button
                          type="button"
                          onClick={header.column.getToggleSortingHandler()}
                          className="inline-flex min-h-6 items-center gap-1 uppercase tracking-wide hover:text-graphite-900"
                        >
                          {content}
                          <span aria-hidden className="text-[0.7rem]">
                            {sorted === 'asc' ? '▲' : sorted === 'desc' ? '▼' : '↕'}
                          </span>
                        </button>
                      ) : (
                        content
                      )}
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody className="divide-y divide-graphite-100">
            {rows.map((row) => (
              <tr key={row.id} className="hover:bg-birch-50">
                {row.getAllCells().map((cell) => (
                  <td
                    key={cell.id}
                    className={cx('px-4 py-3 align-middle text-graphite-800', cell.column.id === 'actions' && 'text-right')}
                  >
                    <table.FlexRender cell={cell} />
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
        {rows.length === 0 && (
          <p className="px-4 py-6 text-center text-sm text-graphite-500">
            {data.length === 0 ? empty : 'Nothing matches the search and filters.'}
          </p>
        )}
      </div>
      <p className="text-xs text-graphite-500" aria-live="polite">
        {rows.length === data.length ? `${data.length} in all` : `${rows.length} of ${data.length} shown`}
      </p>
    </div>
  );
}
