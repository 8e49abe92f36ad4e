import type { ImportRun } from '@millrace/contracts';
import { Button } from '@/components/ui/button';
import { EmptyState } from '@/components/ui/empty-state';
import { importKindLabels } from './import-kinds';

const when = (iso: string) => new Date(iso).toLocaleString('en-GB', { dateStyle: 'medium', timeStyle: 'short' });

/** Applied imports, newest first: the original file, what it did, and undo for the latest of each kind. */
export function ImportHistory({ runs, canUndo, undoing, onUndo }: { runs: ImportRun[]; canUndo: boolean; undoing: boolean; onUndo: (run: ImportRun) => void }) {
  if (runs.length === 0) return <EmptyState title="No imports yet">Applied imports are listed here with their original files.</EmptyState>;
  return (
    <table className="w-full border-collapse bg-panel text-sm">
      <caption className="sr-only">Applied imports</caption>
      <thead className="bg-race-50">
        <tr className="text-left">
          <th scope="col" className="px-2 py-1">When</th>
          <th scope="col" className="px-2 py-1">Kind</th>
          <th scope="col" className="px-2 py-1">File</th>
          <th scope="col" className="px-2 py-1 text-right">Rows</th>
          <th scope="col" className="px-2 py-1">What it did</th>
          <th scope="col" className="px-2 py-1">By</th>
          <th scope="col" className="px-2 py-1">State</th>
          {canUndo ? <th scope="col" className="px-2 py-1"><span className="sr-only">Actions</span></th> : null}
        </tr>
      </thead>
      <tbody>
        {runs.map((r) => (
          <tr key={r.id} className="border-t border-line/60">
            <td className="px-2 py-1">{when(r.appliedAt)}</td>
            <td className="px-2 py-1">{importKindLabels[r.kind]}</td>
            <td className="px-2 py-1">
              <a className="text-race-700 underline" href={`/api/imports/runs/${r.id}/file`} download>
                {r.fileName}
              </a>
            </td>
            <td className="px-2 py-1 text-right tabular-nums">{r.rows}</td>
            <td className="px-2 py-1">
              {r.summary.created} new, {r.summary.updated} changed{r.summary.removed ? `, ${r.summary.removed} removed` : ''}
            </td>
            <td className="px-2 py-1">{r.appliedBy?.name ?? '—'}</td>
            <td className="px-2 py-1">{r.state === 'undone' ? `↶ Undone${r.undoneBy ? ` by ${r.undoneBy.name}` : ''}` : '✓ Applied'}</td>
            {canUndo ? (
              <td className="px-2 py-1">
                {r.undoable ? (
                  <Button size="sm" variant="danger" busy={undoing} busyLabel="Undoing…" onClick={() => onUndo(r)} aria-label={`Undo the import of ${r.fileName}`}>
                    Undo
                  </Button>
                ) : null}
              </td>
            ) : null}
          </tr>
        ))}
      </tbody>
    </table>
  );
}
