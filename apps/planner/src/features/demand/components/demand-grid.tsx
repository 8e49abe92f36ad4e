import { useVirtualizer } from '@tanstack/react-virtual';
import { memo, useEffect, useMemo, useRef, useState, type ClipboardEvent, type KeyboardEvent } from 'react';
import { formatNumber, formatWeek, formatWeekLong } from '@/lib/format';
import { cellKey, isEditable, savedQty, shownQty, weekTotals, type GridLine, type PendingEdits } from './demand-edits';
import { parsePastedBlock, parsePastedNumber } from './parse-pasted-block';

export type CellEdit = { key: string; qty: number };
export type GridNotice = { kind: 'info' | 'problem'; text: string };

type Position = { row: number; col: number };

/** Height of one grid line in pixels (virtualiser estimate). */
const lineHeightPx = 32;
/** Lines drawn beyond the visible window. */
const overscanLines = 10;
/** Lines jumped by Page Up / Page Down. */
const pageLines = 10;

const kindLabel = { firm: 'Firm', forecast: 'Forecast' } as const;

/** The grid position of the cell an event happened in, from its `data-cell="row:col"`. */
function cellAt(target: EventTarget): Position | null {
  const cell = (target as HTMLElement).closest?.('[data-cell]') as HTMLElement | null;
  if (!cell?.dataset.cell) return null;
  const [r, c] = cell.dataset.cell.split(':').map(Number);
  return { row: r, col: c };
}

type Editor = {
  draft: string;
  onChange: (value: string) => void;
  onKeyDown: (e: KeyboardEvent<HTMLInputElement>) => void;
  onBlur: () => void;
};

type GridRowProps = {
  line: GridLine;
  index: number;
  weeks: string[];
  weekNames: string[];
  pending: PendingEdits;
  cellErrors: ReadonlyMap<string, string>;
  readOnly: boolean;
  /** Column of the active cell when it is in this line, else -1. */
  activeCol: number;
  /** The open editor, when the active cell of this line is being edited. */
  editor?: Editor;
};

/**
 * One line of the grid. Memoised: moving the active cell or scrolling redraws only the lines
 * whose props change (events are handled once, on the table).
 */
const GridRow = memo(function GridRow({ line, index, weeks, weekNames, pending, cellErrors, readOnly, activeCol, editor }: GridRowProps) {
  const firstOfProduct = line.kind === 'firm';
  return (
    <tr role="row" aria-rowindex={index + 2} style={{ height: lineHeightPx }} className={firstOfProduct ? 'border-t border-line' : ''}>
      <th role="rowheader" scope="row" className="sticky left-0 z-[1] whitespace-nowrap bg-panel px-2 py-1 text-left font-normal">
        {firstOfProduct ? (
          <>
            <span className="font-semibold">{line.row.productCode}</span> {line.row.productName}
          </>
        ) : (
          <span className="sr-only">
            {line.row.productCode} {line.row.productName}
          </span>
        )}
      </th>
      <th role="rowheader" scope="row" className="px-2 py-1 text-left font-normal text-ink-soft">
        {kindLabel[line.kind]}
      </th>
      {weeks.map((w, c) => {
        const key = cellKey(line.row.productId, w, line.kind);
        const isActive = c === activeCol;
        const qty = shownQty(line, c, pending);
        const changed = qty !== savedQty(line, c);
        const error = cellErrors.get(key);
        const orders = line.kind === 'firm' ? line.row.cells[c].firmOrders.length : 0;
        const editable = isEditable(line, c);
        const name = `${line.row.productCode} ${kindLabel[line.kind].toLowerCase()}, ${weekNames[c]}`;
        return (
          <td
            key={w}
            role="gridcell"
            data-cell={`${index}:${c}`}
            tabIndex={isActive && !editor ? 0 : -1}
            aria-selected={isActive}
            aria-readonly={readOnly || !editable || undefined}
            aria-label={`${name}: ${formatNumber(qty)}${changed ? ', changed' : ''}${orders > 1 ? `, ${orders} orders` : ''}${error ? `, problem: ${error}` : ''}`}
            aria-invalid={error ? true : undefined}
            title={error ?? (orders > 1 ? `${orders} firm orders` : undefined)}
            className={`relative min-w-20 cursor-cell px-2 py-1 text-right tabular-nums outline-none ${isActive ? 'ring-2 ring-inset ring-race-700' : ''} ${
              changed ? 'bg-race-100 font-semibold' : ''
            } ${error ? 'bg-fault-50 text-fault-700' : ''} ${qty === 0 && !changed ? 'text-ink-soft' : ''}`}
          >
            {isActive && editor ? (
              <input
                autoFocus
                aria-label={name}
                inputMode="decimal"
                value={editor.draft}
                onChange={(e) => editor.onChange(e.target.value)}
                onKeyDown={editor.onKeyDown}
                onBlur={editor.onBlur}
                className="w-full rounded border border-race-700 bg-white px-1 text-right"
              />
            ) : (
              <>
                {error ? <span aria-hidden="true">✕ </span> : changed ? <span aria-hidden="true">• </span> : null}
                {orders > 1 ? (
                  <span aria-hidden="true" className="mr-1 text-xs text-ink-soft">
                    {orders}×
                  </span>
                ) : null}
                {qty === 0 && !changed ? '·' : formatNumber(qty)}
              </>
            )}
          </td>
        );
      })}
    </tr>
  );
});

export type DemandGridProps = {
  lines: GridLine[];
  weeks: string[];
  pending: PendingEdits;
  cellErrors: ReadonlyMap<string, string>;
  readOnly: boolean;
  onEdit: (edits: CellEdit[]) => void;
  onNotice: (notice: GridNotice) => void;
  /** Told which cell is active (for the order list under the grid). */
  onActiveChange?: (line: GridLine, week: number) => void;
  maxHeightPx?: number;
};

/**
 * Products × weeks, a firm line and a forecast line per product. Arrow keys, Home/End and Page
 * Up/Down move; Enter, F2 or typing edits; Enter/Tab commit and move on; Escape cancels; Delete
 * sets 0; a tab-separated block pasted from a spreadsheet fills cells from the active one.
 */
export function DemandGrid({ lines, weeks, pending, cellErrors, readOnly, onEdit, onNotice, onActiveChange, maxHeightPx = 560 }: DemandGridProps) {
  const [active, setActive] = useState<Position>({ row: 0, col: 0 });
  const [draft, setDraft] = useState<string | null>(null);
  const scrollRef = useRef<HTMLDivElement>(null);
  const tableRef = useRef<HTMLTableElement>(null);
  const focusInside = useRef(false);

  const rowCount = lines.length;
  const colCount = weeks.length;
  const virtualizer = useVirtualizer({
    count: rowCount,
    getScrollElement: () => scrollRef.current,
    estimateSize: () => lineHeightPx,
    overscan: overscanLines,
    initialRect: { width: 1024, height: maxHeightPx },
  });

  // Keep the active cell inside the grid when the lines change (filtering, reload).
  const row = Math.min(active.row, Math.max(0, rowCount - 1));
  const col = Math.min(active.col, Math.max(0, colCount - 1));

  // After the editor closes its input is gone and focus with it: bring focus back to the grid.
  const refocusAfterEdit = useRef(false);

  useEffect(() => {
    if ((!focusInside.current && !refocusAfterEdit.current) || draft !== null) return;
    refocusAfterEdit.current = false;
    virtualizer.scrollToIndex(row, { align: 'auto' });
    const find = () => tableRef.current?.querySelector<HTMLElement>(`[data-cell="${row}:${col}"]`);
    const cell = find();
    if (cell) {
      cell.focus();
      return;
    }
    // the line is drawn once the virtualiser has scrolled to it
    const frame = requestAnimationFrame(() => find()?.focus());
    return () => cancelAnimationFrame(frame);
  }, [row, col, draft, virtualizer]);

  const onActiveChangeRef = useRef(onActiveChange);
  onActiveChangeRef.current = onActiveChange;
  useEffect(() => {
    if (lines[row]) onActiveChangeRef.current?.(lines[row], col);
  }, [lines, row, col]);

  const keyAt = (r: number, c: number) => cellKey(lines[r].row.productId, weeks[c], lines[r].kind);
  const canEdit = (r: number, c: number) => !readOnly && isEditable(lines[r], c);

  const move = (r: number, c: number) => setActive({ row: Math.max(0, Math.min(rowCount - 1, r)), col: Math.max(0, Math.min(colCount - 1, c)) });

  const commit = (): boolean => {
    if (draft === null) return true;
    const parsed = parsePastedNumber(draft);
    if (parsed === 'invalid') {
      onNotice({ kind: 'problem', text: `“${draft.trim()}” is not a quantity. Enter a whole or decimal number, not negative.` });
      return false;
    }
    onEdit([{ key: keyAt(row, col), qty: parsed ?? 0 }]);
    setDraft(null);
    return true;
  };

  const startEdit = (initial: string) => {
    if (!canEdit(row, col)) {
      onNotice({
        kind: 'info',
        text: readOnly
          ? 'Demand is read only for your role.'
          : 'This week has several firm orders; change each one in the order list below the grid.',
      });
      return;
    }
    setDraft(initial);
  };

  const onCellKeyDown = (e: KeyboardEvent<HTMLElement>) => {
    if (e.defaultPrevented) return;
    if (draft !== null) return;
    const k = e.key;
    const handled = () => e.preventDefault();
    if (k === 'ArrowUp') return handled(), move(row - 1, col);
    if (k === 'ArrowDown') return handled(), move(row + 1, col);
    if (k === 'ArrowLeft') return handled(), move(row, col - 1);
    if (k === 'ArrowRight') return handled(), move(row, col + 1);
    if (k === 'Home') return handled(), move(e.ctrlKey ? 0 : row, 0);
    if (k === 'End') return handled(), move(e.ctrlKey ? rowCount - 1 : row, colCount - 1);
    if (k === 'PageDown') return handled(), move(row + pageLines, col);
    if (k === 'PageUp') return handled(), move(row - pageLines, col);
    if (k === 'Tab') {
      if (!e.shiftKey && (col < colCount - 1 || row < rowCount - 1)) {
        handled();
        return col < colCount - 1 ? move(row, col + 1) : move(row + 1, 0);
      }
      if (e.shiftKey && (col > 0 || row > 0)) {
        handled();
        return col > 0 ? move(row, col - 1) : move(row - 1, colCount - 1);
      }
      return; // leave the grid
    }
    if (k === 'Enter' || k === 'F2') return handled(), startEdit(String(shownQty(lines[row], col, pending)));
    if (k === 'Delete' || k === 'Backspace') {
      handled();
      if (canEdit(row, col)) onEdit([{ key: keyAt(row, col), qty: 0 }]);
      else startEdit('');
      return;
    }
    if (/^[0-9.,]$/.test(k) && !e.ctrlKey && !e.metaKey && !e.altKey) return handled(), startEdit(k);
  };

  const onEditorKeyDown = (e: KeyboardEvent<HTMLInputElement>) => {
    const k = e.key;
    if (k === 'Escape') {
      e.preventDefault();
      refocusAfterEdit.current = true;
      setDraft(null);
      return;
    }
    const next: Record<string, Position | undefined> = {
      Enter: { row: e.shiftKey ? row - 1 : row + 1, col },
      ArrowUp: { row: row - 1, col },
      ArrowDown: { row: row + 1, col },
      Tab: e.shiftKey ? (col > 0 ? { row, col: col - 1 } : { row: row - 1, col: colCount - 1 }) : col < colCount - 1 ? { row, col: col + 1 } : { row: row + 1, col: 0 },
    };
    const to = next[k];
    if (!to) return;
    e.preventDefault();
    refocusAfterEdit.current = true;
    if (commit()) move(to.row, to.col);
    else refocusAfterEdit.current = false;
  };

  const onPaste = (e: ClipboardEvent<HTMLTableElement>) => {
    const text = e.clipboardData.getData('text/plain');
    if (draft !== null && !/[\t\n]/.test(text)) return; // a single value pasted into the open editor
    e.preventDefault();
    if (readOnly) {
      onNotice({ kind: 'info', text: 'Demand is read only for your role.' });
      return;
    }
    const block = parsePastedBlock(text);
    if (block.outcome === 'rejected') {
      onNotice({ kind: 'problem', text: `Nothing was pasted. ${block.problems.join(' ')}` });
      return;
    }
    const edits: CellEdit[] = [];
    let outside = 0;
    let locked = 0;
    block.values.forEach((values, i) =>
      values.forEach((qty, j) => {
        if (qty === null) return;
        const r = row + i;
        const c = col + j;
        if (r >= rowCount || c >= colCount) outside += 1;
        else if (!isEditable(lines[r], c)) locked += 1;
        else edits.push({ key: keyAt(r, c), qty });
      }),
    );
    setDraft(null);
    onEdit(edits);
    const skipped = [
      outside ? `${outside} fell outside the grid` : '',
      locked ? `${locked} landed on weeks with several firm orders` : '',
    ].filter(Boolean);
    onNotice({
      kind: skipped.length ? 'problem' : 'info',
      text: `Pasted ${edits.length} cell${edits.length === 1 ? '' : 's'} from ${kindLabel[lines[row].kind].toLowerCase()} of ${lines[row].row.productCode}, ${formatWeekLong(weeks[col])}.${skipped.length ? ` Not pasted: ${skipped.join('; ')}.` : ''}`,
    });
  };

  const totals = useMemo(() => weekTotals(lines, colCount, pending), [lines, colCount, pending]);
  const weekNames = useMemo(() => weeks.map(formatWeekLong), [weeks]);
  const items = virtualizer.getVirtualItems();
  const paddingTop = items.length ? items[0].start : 0;
  const paddingBottom = items.length ? virtualizer.getTotalSize() - items[items.length - 1].end : 0;

  return (
    <div ref={scrollRef} className="overflow-auto rounded border border-line bg-panel" style={{ maxHeight: maxHeightPx }}>
      <table
        ref={tableRef}
        role="grid"
        aria-label="Demand per product and week"
        aria-rowcount={rowCount + 3}
        aria-colcount={colCount + 2}
        aria-readonly={readOnly || undefined}
        className="w-full border-collapse text-sm"
        onPaste={onPaste}
        onKeyDown={(e) => {
          if ((e.target as HTMLElement).dataset.cell !== undefined) onCellKeyDown(e);
        }}
        onClick={(e) => {
          const at = cellAt(e.target);
          if (!at) return;
          if (draft !== null && !(at.row === row && at.col === col) && !commit()) return;
          setActive(at);
        }}
        onDoubleClick={(e) => {
          const at = cellAt(e.target);
          if (at && at.row === row && at.col === col) startEdit(String(shownQty(lines[row], col, pending)));
        }}
        onFocus={() => {
          focusInside.current = true;
        }}
        onBlur={(e) => {
          if (!e.currentTarget.contains(e.relatedTarget as Node | null)) focusInside.current = false;
        }}
      >
        <thead className="sticky top-0 z-[2] bg-race-50">
          <tr role="row" aria-rowindex={1}>
            <th role="columnheader" scope="col" className="sticky left-0 bg-race-50 px-2 py-1.5 text-left">
              Product
            </th>
            <th role="columnheader" scope="col" className="px-2 py-1.5 text-left">
              Demand
            </th>
            {weeks.map((w) => (
              <th key={w} role="columnheader" scope="col" className="px-2 py-1.5 text-right" aria-label={formatWeekLong(w)}>
                {formatWeek(w)}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {paddingTop > 0 ? (
            <tr aria-hidden="true">
              <td colSpan={colCount + 2} style={{ height: paddingTop, padding: 0 }} />
            </tr>
          ) : null}
          {items.map((item) => {
            const r = item.index;
            const line = lines[r];
            const isActiveRow = r === row;
            return (
              <GridRow
                key={`${line.row.productId}-${line.kind}`}
                line={line}
                index={r}
                weeks={weeks}
                weekNames={weekNames}
                pending={pending}
                cellErrors={cellErrors}
                readOnly={readOnly}
                activeCol={isActiveRow ? col : -1}
                editor={
                  isActiveRow && draft !== null
                    ? { draft, onChange: setDraft, onKeyDown: onEditorKeyDown, onBlur: () => void commit() }
                    : undefined
                }
              />
            );
          })}
          {paddingBottom > 0 ? (
            <tr aria-hidden="true">
              <td colSpan={colCount + 2} style={{ height: paddingBottom, padding: 0 }} />
            </tr>
          ) : null}
        </tbody>
        <tfoot className="sticky bottom-0 z-[2] bg-race-50 font-semibold">
          {(['firm', 'forecast'] as const).map((kind, i) => (
            <tr key={kind} role="row" aria-rowindex={rowCount + 2 + i}>
              <th role="rowheader" scope="row" className="sticky left-0 bg-race-50 px-2 py-1.5 text-left">
                Week total
              </th>
              <th role="rowheader" scope="row" className="px-2 py-1.5 text-left">
                {kindLabel[kind]}
              </th>
              {weeks.map((w, c) => (
                <td key={w} role="gridcell" aria-label={`${kindLabel[kind]} total, ${weekNames[c]}: ${formatNumber(totals[kind][c])}`} className="px-2 py-1.5 text-right tabular-nums">
                  {formatNumber(totals[kind][c])}
                </td>
              ))}
            </tr>
          ))}
        </tfoot>
      </table>
    </div>
  );
}
