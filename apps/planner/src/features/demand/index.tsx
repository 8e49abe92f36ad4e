import { useEffect, useMemo, useState } from 'react';
import { useSearchParams } from 'react-router-dom';
import { addDays, type ProductKind } from '@millrace/contracts';
import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { ErrorState } from '@/components/ui/error-state';
import { Input } from '@/components/ui/field';
import { Loading } from '@/components/ui/loading';
import { PageHeader } from '@/components/ui/page-header';
import { ReadOnlyNote } from '@/components/ui/read-only-note';
import { isApiError } from '@/lib/api-client';
import { useUrlTextParam } from '@/lib/use-url-text-param';
import { formatWeekLong } from '@/lib/format';
import { useDemand } from './api/get-demand';
import { useSaveDemand } from './api/save-demand';
import { CellOrders } from './components/cell-orders';
import { buildChanges, gridLines, pendingChanges, type GridLine } from './components/demand-edits';
import { DemandGrid, type CellEdit, type GridNotice } from './components/demand-grid';
import { withSearchParam } from '@/lib/search-params';

/** Horizons offered (weeks). */
const weekChoices = [4, 8, 13, 26] as const;
const defaultWeeks = 13;

type Conflict = { message: string } | null;

export function DemandPage({ canEdit }: { canEdit: boolean }) {
  const [params, setParams] = useSearchParams();
  const asked = Number(params.get('weeks'));
  const weeks = (weekChoices as readonly number[]).includes(asked) ? asked : defaultWeeks;
  const from = /^\d{4}-\d{2}-\d{2}$/.test(params.get('from') ?? '') ? params.get('from')! : undefined;
  const [q, setQ] = useUrlTextParam('q');
  const kind = (params.get('kind') ?? '') as ProductKind | '';

  const demand = useDemand({ from, weeks });
  const save = useSaveDemand();
  const [pending, setPending] = useState<Map<string, number>>(new Map());
  const [cellErrors, setCellErrors] = useState<Map<string, string>>(new Map());
  const [notice, setNotice] = useState<GridNotice | null>(null);
  const [conflict, setConflict] = useState<Conflict>(null);
  const [orderRef, setOrderRef] = useState('');
  const [activeCell, setActiveCell] = useState<{ line: GridLine; week: number } | null>(null);

  const setParam = (key: string, value: string) => setParams((prev) => withSearchParam(prev, key, value), { replace: true });

  const lines = useMemo(() => {
    const rows = demand.data?.rows ?? [];
    const needle = q.trim().toLowerCase();
    return gridLines(
      rows.filter(
        (r) => (!kind || r.kind === kind) && (!needle || r.productCode.toLowerCase().includes(needle) || r.productName.toLowerCase().includes(needle)),
      ),
    );
  }, [demand.data, q, kind]);

  const changeCount = useMemo(() => (demand.data ? pendingChanges(demand.data.rows, pending).length : 0), [demand.data, pending]);

  useEffect(() => {
    if (changeCount === 0) return;
    const warn = (e: BeforeUnloadEvent) => e.preventDefault();
    window.addEventListener('beforeunload', warn);
    return () => window.removeEventListener('beforeunload', warn);
  }, [changeCount]);

  const onEdit = (edits: CellEdit[]) => {
    if (edits.length === 0) return;
    setPending((prev) => {
      const next = new Map(prev);
      for (const e of edits) next.set(e.key, e.qty);
      return next;
    });
    setCellErrors((prev) => {
      if (prev.size === 0) return prev;
      const next = new Map(prev);
      for (const e of edits) next.delete(e.key);
      return next;
    });
  };

  const onSave = () => {
    if (!demand.data) return;
    const set = buildChanges(demand.data, pending, orderRef);
    if (set.outcome === 'needs-order-ref') {
      setNotice({
        kind: 'problem',
        text: `${set.count} firm quantit${set.count === 1 ? 'y goes' : 'ies go'} into weeks without an order. Enter the customer order reference for new firm quantities, then save.`,
      });
      document.getElementById('new-order-ref')?.focus();
      return;
    }
    if (set.changes.length === 0) {
      setPending(new Map());
      setNotice({ kind: 'info', text: 'Nothing to save: every cell holds its saved quantity.' });
      return;
    }
    setNotice(null);
    setConflict(null);
    save.mutate(
      { changes: set.changes },
      {
        onSuccess: (result) => {
          setPending(new Map());
          setCellErrors(new Map());
          setNotice({
            kind: 'info',
            text: `✓ Saved in one go: ${result.created} new, ${result.updated} changed, ${result.deleted} removed.`,
          });
        },
        onError: (error) => {
          const errors = new Map<string, string>();
          if (isApiError(error)) {
            for (const f of error.fields) {
              const m = /^changes\.(\d+)/.exec(f.path);
              if (m && set.keys[Number(m[1])]) errors.set(set.keys[Number(m[1])], f.message);
            }
          }
          setCellErrors(errors);
          if (isApiError(error) && error.status === 409) setConflict({ message: error.message });
          else
            setNotice({
              kind: 'problem',
              text: `Nothing was saved. ${error instanceof Error ? error.message : ''}${errors.size ? ` ${errors.size} cell${errors.size === 1 ? ' is' : 's are'} marked ✕ in the grid.` : ''}`,
            });
        },
      },
    );
  };

  const reloadKeep = async () => {
    setConflict(null);
    setCellErrors(new Map());
    await demand.refetch();
    setNotice({ kind: 'info', text: 'Reloaded. Your changes are still on top; save again to apply them over the other change.' });
  };
  const discard = async () => {
    setConflict(null);
    setCellErrors(new Map());
    setPending(new Map());
    await demand.refetch();
    setNotice({ kind: 'info', text: 'Your unsaved changes were discarded.' });
  };

  const shiftWindow = (deltaWeeks: number) => {
    const first = demand.data?.weeks[0];
    if (first) setParam('from', addDays(first, deltaWeeks * 7));
  };

  const hasChanges = changeCount > 0;
  const activeRow = activeCell ? activeCell.line.row : null;

  return (
    <>
      <PageHeader
        title="Demand"
        description="Firm customer orders and forecast per product and week. Type, paste a block from a spreadsheet, then save all changes at once."
      />
      {!canEdit ? <ReadOnlyNote who="planners" /> : null}
      <div className="mb-3 flex flex-wrap items-end gap-3">
        <Input label="Find product" type="search" value={q} onChange={(e) => setQ(e.target.value)} fieldClassName="w-56" />
        <label className="flex flex-col gap-1 text-sm font-semibold">
          Kind
          <select value={kind} onChange={(e) => setParam('kind', e.target.value)} className="rounded border border-line bg-panel px-2 py-1.5 font-normal">
            <option value="">All products</option>
            <option value="finished">Finished goods</option>
            <option value="subassembly">Sub-assemblies</option>
          </select>
        </label>
        <label className="flex flex-col gap-1 text-sm font-semibold">
          Weeks shown
          <select
            value={weeks}
            disabled={hasChanges}
            onChange={(e) => setParam('weeks', e.target.value)}
            className="rounded border border-line bg-panel px-2 py-1.5 font-normal"
          >
            {weekChoices.map((w) => (
              <option key={w} value={w}>
                {w}
              </option>
            ))}
          </select>
        </label>
        <div className="flex gap-1">
          <Button disabled={hasChanges || !demand.data} onClick={() => shiftWindow(-weeks)}>
            ← Earlier
          </Button>
          <Button disabled={hasChanges || !from} onClick={() => setParam('from', '')}>
            This week
          </Button>
          <Button disabled={hasChanges || !demand.data} onClick={() => shiftWindow(weeks)}>
            Later →
          </Button>
        </div>
        {hasChanges ? <p className="text-sm text-ink-soft">Save or discard your changes to move to other weeks.</p> : null}
      </div>

      {canEdit ? (
        <div className="sticky top-0 z-[2] mb-3 flex flex-wrap items-end gap-3 rounded border border-line bg-panel p-3">
          <Input
            id="new-order-ref"
            label="Order reference for new firm quantities"
            hint="Used when a firm quantity goes into a week with no order yet."
            value={orderRef}
            onChange={(e) => setOrderRef(e.target.value)}
            fieldClassName="w-72"
          />
          <p role="status" aria-live="polite" className="min-w-40 text-sm font-semibold">
            {hasChanges ? `• ${changeCount} unsaved change${changeCount === 1 ? '' : 's'}` : 'No unsaved changes'}
          </p>
          <Button variant="primary" disabled={!hasChanges} busy={save.isPending} busyLabel="Saving…" onClick={onSave}>
            Save changes
          </Button>
          <Button variant="quiet" disabled={!hasChanges || save.isPending} onClick={() => void discard()}>
            Discard changes
          </Button>
        </div>
      ) : null}

      {conflict ? (
        <div role="alert" className="mb-3 flex flex-wrap items-center justify-between gap-3 rounded border border-over-700 bg-over-50 p-3">
          <div>
            <p className="font-semibold text-over-700">
              <span aria-hidden="true">⟳ </span>Changed by someone else — nothing was saved
            </p>
            <p>{conflict.message} The cells concerned are marked ✕.</p>
          </div>
          <div className="flex gap-2">
            <Button onClick={() => void reloadKeep()}>Reload, keep my changes</Button>
            <Button variant="danger" onClick={() => void discard()}>
              Reload, discard my changes
            </Button>
          </div>
        </div>
      ) : null}

      <div role={notice?.kind === 'problem' ? 'alert' : 'status'} aria-live="polite" className="mb-3 min-h-6 text-sm">
        {notice ? (
          <p className={notice.kind === 'problem' ? 'text-fault-700' : ''}>
            {notice.kind === 'problem' ? <span aria-hidden="true">✕ </span> : null}
            {notice.text}
          </p>
        ) : null}
      </div>

      {demand.isPending ? <Loading label="Loading demand…" /> : null}
      {demand.isError ? <ErrorState error={demand.error} onRetry={() => void demand.refetch()} /> : null}
      {demand.data ? (
        demand.data.rows.length === 0 ? (
          <EmptyState title="No products to plan yet">Add products first; their demand per week shows here.</EmptyState>
        ) : lines.length === 0 ? (
          <EmptyState title="No product matches the search" />
        ) : (
          <div className="flex flex-col gap-3">
            <p className="text-sm text-ink-soft">
              {formatWeekLong(demand.data.weeks[0])} to {formatWeekLong(demand.data.weeks[demand.data.weeks.length - 1])} · {lines.length / 2} product{lines.length === 2 ? '' : 's'}
              {lines.length / 2 < demand.data.rows.length ? ` of ${demand.data.rows.length} (week totals cover the products shown)` : ''} · • marks a changed
              cell, ✕ a cell with a problem, 2× a week with several firm orders.
            </p>
            <DemandGrid
              lines={lines}
              weeks={demand.data.weeks}
              pending={pending}
              cellErrors={cellErrors}
              readOnly={!canEdit}
              onEdit={onEdit}
              onNotice={setNotice}
              onActiveChange={(line, week) => setActiveCell({ line, week })}
            />
            {activeRow && activeCell && activeCell.line.kind === 'firm' && activeRow.cells[activeCell.week] ? (
              <CellOrders
                productId={activeRow.productId}
                productCode={activeRow.productCode}
                unit={activeRow.unit}
                cell={activeRow.cells[activeCell.week]}
                pending={pending}
                readOnly={!canEdit}
                onEdit={onEdit}
                onNotice={setNotice}
              />
            ) : null}
          </div>
        )
      ) : null}
    </>
  );
}
