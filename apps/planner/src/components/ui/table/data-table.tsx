import {
  flexRender,
  getCoreRowModel,
  getFilteredRowModel,
  getSortedRowModel,
  useReactTable,
  type ColumnDef,
  type Row,
  type Updater,
  type RowData,
} from '@tanstack/react-table';
import { useVirtualizer } from '@tanstack/react-virtual';
import { memo, useId, useRef, type ReactNode } from 'react';
import { useTableUrlState } from './use-table-url-state';

declare module '@tanstack/react-table' {
  // eslint-disable-next-line @typescript-eslint/no-unused-vars
  interface ColumnMeta<TData extends RowData, TValue> {
    /** A choice filter drawn above the table for this column. */
    filterOptions?: readonly { value: string; label: string }[];
    /** Right-align numbers. */
    numeric?: boolean;
  }
}

/** Height of one body row in pixels, used by the virtualiser (matches the py-1.5 text-sm rows). */
const rowHeightPx = 34;
/** Rows drawn beyond the visible window in each direction. */
const overscanRows = 12;

function resolve<T>(updater: Updater<T>, current: T): T {
  return typeof updater === 'function' ? (updater as (old: T) => T)(current) : updater;
}

type DataRowProps<T> = {
  row: Row<T>;
  index: number;
  columnsKey: string;
  columns: unknown;
  /** Tells the virtualiser the row's real height (long text wraps at narrow widths). */
  measure: (element: Element | null) => void;
};

/**
 * One body row, memoised so that scrolling draws only rows that come into view. `columnsKey`
 * changes when columns are shown or hidden; new column definitions (e.g. with new actions) redraw too.
 */
const DataRow = memo(function DataRow<T>({ row, index, measure }: DataRowProps<T>) {
  return (
    <tr ref={measure} data-index={index} aria-rowindex={index + 2} className="border-b border-line/60 hover:bg-race-50" style={{ height: rowHeightPx }}>
      {row.getVisibleCells().map((cell) => (
        <td key={cell.id} className={`px-2 py-1.5 ${cell.column.columnDef.meta?.numeric ? 'text-right tabular-nums' : ''}`}>
          {flexRender(cell.column.columnDef.cell, cell.getContext())}
        </td>
      ))}
    </tr>
  );
}) as <T>(props: DataRowProps<T>) => ReactNode;

export type DataTableProps<T> = {
  /** Accessible name of the table (also its caption). */
  label: string;
  columns: ColumnDef<T, any>[];
  data: T[];
  /** Shown instead of the table when there are no rows at all. */
  empty: ReactNode;
  getRowId?: (row: T) => string;
  /** Height of the scrolling body; rows outside it are not drawn. */
  maxHeightPx?: number;
  toolbar?: ReactNode;
};

/**
 * The planner's table: sorting, a search box and per-column choice filters kept in the URL,
 * column visibility, and a virtualised body so 2,000 rows scroll smoothly.
 */
export function DataTable<T>({ label, columns, data, empty, getRowId, maxHeightPx = 560, toolbar }: DataTableProps<T>) {
  const state = useTableUrlState();
  const searchId = useId();
  const table = useReactTable({
    data,
    columns,
    getRowId,
    state: {
      sorting: state.sorting,
      globalFilter: state.globalFilter,
      columnFilters: state.columnFilters,
      columnVisibility: state.columnVisibility,
    },
    onSortingChange: (u) => state.setSorting(resolve(u, state.sorting)),
    onGlobalFilterChange: (u) => state.setGlobalFilter(String(resolve(u, state.globalFilter) ?? '')),
    onColumnFiltersChange: (u) => state.setColumnFilters(resolve(u, state.columnFilters)),
    onColumnVisibilityChange: (u) => state.setColumnVisibility(resolve(u, state.columnVisibility)),
    getCoreRowModel: getCoreRowModel(),
    getSortedRowModel: getSortedRowModel(),
    getFilteredRowModel: getFilteredRowModel(),
    globalFilterFn: 'includesString',
  });

  const scrollRef = useRef<HTMLDivElement>(null);
  const rows = table.getRowModel().rows;
  const virtualizer = useVirtualizer({
    count: rows.length,
    getScrollElement: () => scrollRef.current,
    estimateSize: () => rowHeightPx,
    overscan: overscanRows,
    // jsdom and first paint have no layout: draw a first window of rows.
    initialRect: { width: 1024, height: maxHeightPx },
  });
  const items = virtualizer.getVirtualItems();
  const paddingTop = items.length > 0 ? items[0].start : 0;
  const paddingBottom = items.length > 0 ? virtualizer.getTotalSize() - items[items.length - 1].end : 0;
  const visibleColumns = table.getVisibleLeafColumns();
  const visibleColumnCount = visibleColumns.length;
  const visibilityKey = visibleColumns.map((c) => c.id).join(',');
  const filterable = table.getAllLeafColumns().filter((c) => c.columnDef.meta?.filterOptions);

  if (data.length === 0) return <>{empty}</>;

  return (
    <div className="flex flex-col gap-2">
      <div className="flex flex-wrap items-end gap-3">
        <div className="flex flex-col gap-1">
          <label htmlFor={searchId} className="text-sm font-semibold">
            Search {label.toLowerCase()}
          </label>
          <input
            id={searchId}
            type="search"
            value={state.globalFilter}
            onChange={(e) => state.setGlobalFilter(e.target.value)}
            className="w-64 rounded border border-line bg-panel px-2 py-1.5"
          />
        </div>
        {filterable.map((column) => {
          const header = typeof column.columnDef.header === 'string' ? column.columnDef.header : column.id;
          return (
            <label key={column.id} className="flex flex-col gap-1 text-sm font-semibold">
              {header}
              <select
                value={String(column.getFilterValue() ?? '')}
                onChange={(e) => column.setFilterValue(e.target.value || undefined)}
                className="rounded border border-line bg-panel px-2 py-1.5 font-normal"
              >
                <option value="">All</option>
                {column.columnDef.meta!.filterOptions!.map((o) => (
                  <option key={o.value} value={o.value}>
                    {o.label}
                  </option>
                ))}
              </select>
            </label>
          );
        })}
        <details className="relative">
          <summary className="cursor-pointer rounded border border-line bg-panel px-2 py-1.5 text-sm font-semibold">Columns</summary>
          <fieldset className="absolute z-10 mt-1 flex min-w-48 flex-col gap-1 rounded border border-line bg-panel p-2 shadow">
            <legend className="sr-only">Columns shown</legend>
            {table
              .getAllLeafColumns()
              .filter((c) => c.getCanHide())
              .map((column) => (
                <label key={column.id} className="flex items-center gap-2 text-sm">
                  <input type="checkbox" checked={column.getIsVisible()} onChange={column.getToggleVisibilityHandler()} />
                  {typeof column.columnDef.header === 'string' ? column.columnDef.header : column.id}
                </label>
              ))}
          </fieldset>
        </details>
        {toolbar ? <div className="ml-auto flex gap-2">{toolbar}</div> : null}
      </div>
      <p role="status" aria-live="polite" className="text-sm text-ink-soft">
        {rows.length === data.length ? `${data.length} ${data.length === 1 ? 'row' : 'rows'}` : `${rows.length} of ${data.length} ${data.length === 1 ? 'row matches' : 'rows match'}`}
      </p>
      <div ref={scrollRef} className="overflow-auto rounded border border-line bg-panel" style={{ maxHeight: maxHeightPx }}>
        <table aria-label={label} aria-rowcount={rows.length + 1} className="w-full border-collapse text-sm">
          <thead className="sticky top-0 z-[1] bg-race-50">
            {table.getHeaderGroups().map((group) => (
              <tr key={group.id} aria-rowindex={1}>
                {group.headers.map((header) => {
                  const sorted = header.column.getIsSorted();
                  const numeric = header.column.columnDef.meta?.numeric;
                  return (
                    <th
                      key={header.id}
                      scope="col"
                      aria-sort={sorted === 'asc' ? 'ascending' : sorted === 'desc' ? 'descending' : undefined}
                      className={`border-b border-line px-2 py-1.5 font-semibold ${numeric ? 'text-right' : 'text-left'}`}
                    >
                      {header.isPlaceholder ? null : header.column.getCanSort() ? (
                        <button
                          type="button"
                          onClick={header.column.getToggleSortingHandler()}
                          className="inline-flex items-center gap-1 font-semibold"
                        >
                          {flexRender(header.column.columnDef.header, header.getContext())}
                          <span aria-hidden="true" className="text-ink-soft">
                            {sorted === 'asc' ? '▲' : sorted === 'desc' ? '▼' : '↕'}
                          </span>
                        </button>
                      ) : (
                        flexRender(header.column.columnDef.header, header.getContext())
                      )}
                    </th>
                  );
                })}
              </tr>
            ))}
          </thead>
          <tbody>
            {paddingTop > 0 ? (
              <tr aria-hidden="true">
                <td colSpan={visibleColumnCount} style={{ height: paddingTop, padding: 0 }} />
              </tr>
            ) : null}
            {items.map((item) => (
              <DataRow
                key={rows[item.index].id}
                row={rows[item.index]}
                index={item.index}
                columnsKey={visibilityKey}
                columns={columns}
                measure={virtualizer.measureElement}
              />
            ))}
            {paddingBottom > 0 ? (
              <tr aria-hidden="true">
                <td colSpan={visibleColumnCount} style={{ height: paddingBottom, padding: 0 }} />
              </tr>
            ) : null}
            {rows.length === 0 ? (
              <tr>
                <td colSpan={visibleColumnCount} className="px-2 py-6 text-center text-ink-soft">
                  No rows match the search and filters.
                </td>
              </tr>
            ) : null}
          </tbody>
        </table>
      </div>
    </div>
  );
}
