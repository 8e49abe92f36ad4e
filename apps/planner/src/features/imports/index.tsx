import { useId, useState } from 'react';
import { useSearchParams } from 'react-router-dom';
import { importKindSchema, importMaxFileBytes, type ImportKind, type ImportMapping, type ImportPreview as Preview, type ImportRun } from '@millrace/contracts';
import { Button } from '@/components/ui/button';
import { ErrorState } from '@/components/ui/error-state';
import { Loading } from '@/components/ui/loading';
import { PageHeader } from '@/components/ui/page-header';
import { ReadOnlyNote } from '@/components/ui/read-only-note';
import { isApiError } from '@/lib/api-client';
import { useApplyImport } from './api/apply-import';
import { useImportRuns } from './api/get-import-runs';
import { usePreviewImport } from './api/preview-import';
import { useUndoImport } from './api/undo-import';
import { ImportColumns } from './components/import-columns';
import { ImportHistory } from './components/import-history';
import { importKindLabels } from './components/import-kinds';
import { ImportPreview } from './components/import-preview';
import { PlanExports } from './components/plan-exports';

type Notice = { kind: 'done' | 'failed'; text: string } | null;

function failure(error: unknown): string {
  if (isApiError(error)) {
    const details = [...error.issues.map((i) => `${i.item}: ${i.message}`), ...error.fields.map((f) => `${f.path}: ${f.message}`)].slice(0, 8);
    return [error.message, ...details].join(' ');
  }
  return error instanceof Error ? error.message : 'The request failed.';
}

/** Spreadsheet imports (CSV or XLSX) and exports of master data and demand. */
export function ImportsPage({ canImport }: { canImport: boolean }) {
  const [params, setParams] = useSearchParams();
  const parsedKind = importKindSchema.safeParse(params.get('kind'));
  const kind: ImportKind = parsedKind.success ? parsedKind.data : 'demand';
  const [file, setFile] = useState<File | null>(null);
  const [preview, setPreview] = useState<Preview | null>(null);
  const [notice, setNotice] = useState<Notice>(null);
  // a new key empties the file input after an import
  const [fileInputKey, setFileInputKey] = useState(0);
  const fileId = useId();
  const check = usePreviewImport();
  const apply = useApplyImport();
  const undo = useUndoImport();
  const runs = useImportRuns();

  const runCheck = (mapping?: ImportMapping, where?: { sheet?: string; headerRow?: number }) => {
    if (!file) return;
    setNotice(null);
    // A new sheet or header row starts the mapping over; a new mapping keeps sheet and header row.
    const sheet = where ? where.sheet : (preview?.sheet ?? undefined);
    const headerRow = where ? where.headerRow : preview?.headerRow;
    check.mutate(
      { kind, file, mapping, sheet, headerRow },
      { onSuccess: setPreview, onError: (e) => setNotice({ kind: 'failed', text: failure(e) }) },
    );
  };
  const runApply = (mapping: ImportMapping) => {
    if (!file) return;
    apply.mutate(
      { kind, file, mapping, sheet: preview?.sheet ?? undefined, headerRow: preview?.headerRow },
      {
        onSuccess: ({ summary }) => {
          setPreview(null);
          setFile(null);
          setFileInputKey((k) => k + 1);
          setNotice({ kind: 'done', text: `Imported: ${summary.created} new, ${summary.updated} changed, ${summary.unchanged} unchanged${summary.removed ? `, ${summary.removed} removed` : ''}.` });
        },
        onError: (e) => setNotice({ kind: 'failed', text: `Nothing was imported. ${failure(e)}` }),
      },
    );
  };
  const runUndo = (run: ImportRun) => {
    if (!window.confirm(`Undo the import of ${run.fileName}? What it changed goes back to how it was before.`)) return;
    undo.mutate(run.kind, {
      onSuccess: () => setNotice({ kind: 'done', text: `The import of ${run.fileName} was undone.` }),
      onError: (e) => setNotice({ kind: 'failed', text: failure(e) }),
    });
  };

  return (
    <>
      <PageHeader title="Imports" description="Bring master data and demand in from spreadsheets (CSV or XLSX), check every row first, then apply in one go." />
      {!canImport ? <ReadOnlyNote who="planners" /> : null}
      <div className="mb-4 flex flex-wrap items-end gap-4 rounded border border-line bg-panel p-4">
        <label className="flex flex-col gap-1 text-sm font-semibold">
          What the file holds
          <select
            value={kind}
            onChange={(e) => {
              setParams({ kind: e.target.value }, { replace: true });
              setPreview(null);
            }}
            className="rounded border border-line bg-panel px-2 py-1.5 font-normal"
          >
            {importKindSchema.options.map((k) => (
              <option key={k} value={k}>
                {importKindLabels[k]}
              </option>
            ))}
          </select>
        </label>
        {canImport ? (
          <>
            <div className="flex flex-col gap-1">
              <label htmlFor={fileId} className="text-sm font-semibold">
                File (CSV or XLSX, at most {importMaxFileBytes / 1024 / 1024} MB)
              </label>
              <input
                key={fileInputKey}
                id={fileId}
                type="file"
                accept=".csv,.xlsx,text/csv,application/vnd.openxmlformats-officedocument.spreadsheetml.sheet"
                onChange={(e) => {
                  setFile(e.target.files?.[0] ?? null);
                  setPreview(null);
                }}
                className="text-sm"
              />
            </div>
            <Button variant="primary" disabled={!file} busy={check.isPending} busyLabel="Checking…" onClick={() => runCheck()}>
              Check file
            </Button>
          </>
        ) : null}
        <div className="ml-auto flex flex-col gap-1 text-sm">
          <span className="font-semibold">Current {importKindLabels[kind].toLowerCase()} as a file</span>
          <span className="flex gap-3">
            <a className="text-race-700 underline" href={`/api/exports/${kind}?format=csv`} download>
              CSV
            </a>
            <a className="text-race-700 underline" href={`/api/exports/${kind}?format=xlsx`} download>
              XLSX
            </a>
          </span>
        </div>
      </div>

      <ImportColumns kind={kind} />

      <div role="status" aria-live="polite">
        {notice ? (
          <p className={`mb-4 rounded border p-2 ${notice.kind === 'done' ? 'border-fine-700 bg-fine-50' : 'border-fault-700 bg-fault-50'}`}>
            <span aria-hidden="true">{notice.kind === 'done' ? '✓ ' : '✕ '}</span>
            {notice.text}
          </p>
        ) : null}
      </div>

      {preview ? (
        <div className="mb-8">
          <ImportPreview
            key={JSON.stringify(preview.mapping) + preview.fileName}
            preview={preview}
            busy={check.isPending ? 'checking' : apply.isPending ? 'applying' : null}
            onCheckAgain={runCheck}
            onReread={(where) => runCheck(undefined, where)}
            onApply={runApply}
          />
        </div>
      ) : null}

      <PlanExports />

      <section aria-labelledby="history-heading">
        <h2 id="history-heading" className="mb-2 text-lg font-semibold">
          Imports so far
        </h2>
        {runs.isPending ? <Loading label="Loading imports…" /> : null}
        {runs.isError ? <ErrorState error={runs.error} onRetry={() => void runs.refetch()} /> : null}
        {runs.data ? <ImportHistory runs={runs.data} canUndo={canImport} undoing={undo.isPending} onUndo={runUndo} /> : null}
      </section>
    </>
  );
}
