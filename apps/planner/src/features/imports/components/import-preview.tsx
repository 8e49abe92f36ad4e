import { useState } from 'react';
import { importFields, type ImportMapping, type ImportPreview as Preview } from '@millrace/contracts';
import { Button } from '@/components/ui/button';
import { useSaveMapping } from '../api/save-mapping';

/** Rows drawn in the preview; the counts above cover every row. */
const maxRowsShown = 300;

const outcomeText = { create: '+ new', update: '✎ change', unchanged: '= same', error: '✕ problem' } as const;

export function ImportPreview({
  preview,
  busy,
  onCheckAgain,
  onReread,
  onApply,
}: {
  preview: Preview;
  busy: 'checking' | 'applying' | null;
  onCheckAgain: (mapping: ImportMapping) => void;
  /** reads the file again from another sheet or header row (the mapping starts over) */
  onReread: (where: { sheet?: string; headerRow?: number }) => void;
  onApply: (mapping: ImportMapping) => void;
}) {
  const saveMapping = useSaveMapping();
  const fields = importFields[preview.kind];
  const [mapping, setMapping] = useState<ImportMapping>(preview.mapping);
  const [onlyProblems, setOnlyProblems] = useState(preview.counts.errorRows > 0);
  const mappingChanged = JSON.stringify(mapping) !== JSON.stringify(preview.mapping);
  const canApply = !mappingChanged && preview.fileErrors.length === 0 && preview.counts.errorRows === 0 && preview.counts.rows > 0;
  const mapped = fields.filter((f) => preview.mapping[f.key]);
  const rows = (onlyProblems ? preview.rows.filter((r) => r.outcome === 'error') : preview.rows).slice(0, maxRowsShown);
  const s = preview.summary;

  return (
    <section aria-labelledby="preview-heading" className="flex flex-col gap-4 rounded border border-line bg-panel p-4">
      <h2 id="preview-heading" className="text-lg font-semibold">
        {preview.fileName}
        {preview.sheet ? `, sheet “${preview.sheet}”` : ''}: {preview.counts.rows} rows
      </h2>

      <div className="flex flex-wrap items-end gap-4 text-sm">
        {preview.sheets.length > 1 ? (
          <label className="flex flex-col gap-1 font-semibold">
            Sheet
            <select
              value={preview.sheet ?? ''}
              onChange={(e) => onReread({ sheet: e.target.value })}
              className="rounded border border-line bg-panel px-2 py-1 font-normal"
            >
              {preview.sheets.map((name) => (
                <option key={name} value={name}>
                  {name}
                </option>
              ))}
            </select>
          </label>
        ) : null}
        <label className="flex flex-col gap-1 font-semibold">
          Header on row
          <input
            type="number"
            min={1}
            defaultValue={preview.headerRow}
            onBlur={(e) => {
              const row = Number(e.target.value);
              if (Number.isInteger(row) && row >= 1 && row !== preview.headerRow) onReread({ sheet: preview.sheet ?? undefined, headerRow: row });
            }}
            className="w-24 rounded border border-line bg-panel px-2 py-1 font-normal"
          />
        </label>
        <span className="text-ink-soft">
          {preview.format === 'csv' ? `CSV, fields split by ${preview.delimiter === ';' ? 'semicolons' : preview.delimiter === '\t' ? 'tabs' : 'commas'}.` : 'XLSX workbook.'}
        </span>
      </div>

      {preview.fileErrors.length > 0 ? (
        <div role="alert" className="rounded border border-fault-700 bg-fault-50 p-3">
          <p className="font-semibold text-fault-700">
            <span aria-hidden="true">✕ </span>The file cannot be imported yet
          </p>
          <ul className="list-disc pl-5">
            {preview.fileErrors.map((e) => (
              <li key={e}>{e}</li>
            ))}
          </ul>
        </div>
      ) : null}

      <fieldset className="rounded border border-line p-3">
        <legend className="px-1 font-semibold">Which column holds what</legend>
        <p className="mb-2 text-sm text-ink-soft">
          {preview.mappingSource === 'saved' ? 'Using the mapping saved from the last import of this kind.' : preview.mappingSource === 'sent' ? 'Using your mapping.' : 'Suggested from the column titles.'}
        </p>
        <div className="grid grid-cols-3 gap-3">
          {fields.map((f) => (
            <label key={f.key} className="flex flex-col gap-1 text-sm font-semibold">
              {f.label}
              {f.required ? ' (required)' : ''}
              <select
                value={mapping[f.key] ?? ''}
                onChange={(e) => setMapping({ ...mapping, [f.key]: e.target.value || null })}
                className="rounded border border-line bg-panel px-2 py-1 font-normal"
              >
                <option value="">— not in the file —</option>
                {preview.columns.map((c) => (
                  <option key={c} value={c}>
                    {c}
                  </option>
                ))}
              </select>
            </label>
          ))}
        </div>
        <div className="mt-3 flex gap-2">
          <Button size="sm" disabled={!mappingChanged} busy={busy === 'checking'} busyLabel="Checking…" onClick={() => onCheckAgain(mapping)}>
            Check again with this mapping
          </Button>
          <Button size="sm" variant="quiet" onClick={() => setMapping(preview.suggestedMapping)}>
            Use the suggested mapping
          </Button>
          <Button size="sm" busy={saveMapping.isPending} busyLabel="Saving…" onClick={() => saveMapping.mutate({ kind: preview.kind, mapping })}>
            Keep this mapping for the next {preview.kind} file
          </Button>
        </div>
        {saveMapping.isSuccess ? (
          <p role="status" className="mt-2 text-sm">
            <span aria-hidden="true">✓ </span>Mapping kept: the next file of this kind starts from it.
          </p>
        ) : null}
        {saveMapping.isError ? (
          <p role="alert" className="mt-2 text-sm text-fault-700">
            <span aria-hidden="true">✕ </span>
            {saveMapping.error.message}
          </p>
        ) : null}
      </fieldset>

      <p role="status" className="font-semibold">
        {preview.counts.errorRows > 0
          ? `✕ ${preview.counts.errorRows} of ${preview.counts.rows} rows have problems. Fix them in the file (or the mapping) and check again; nothing is imported while any row is wrong.`
          : `Applying would add ${s.created}, change ${s.updated}, leave ${s.unchanged} as they are${s.removed ? ` and remove ${s.removed} lines the file replaces` : ''}.`}
      </p>

      <div className="flex items-center gap-3">
        <Button variant="primary" disabled={!canApply} busy={busy === 'applying'} busyLabel="Importing…" onClick={() => onApply(mapping)}>
          Import {preview.counts.rows} rows
        </Button>
        {mappingChanged ? <span className="text-sm text-ink-soft">Check again before importing: the mapping changed.</span> : null}
        <label className="ml-auto flex items-center gap-2 text-sm">
          <input type="checkbox" checked={onlyProblems} onChange={(e) => setOnlyProblems(e.target.checked)} />
          Only rows with problems
        </label>
      </div>

      <div className="max-h-[28rem] overflow-auto rounded border border-line">
        <table className="w-full border-collapse text-sm">
          <caption className="sr-only">Rows of the file and what importing does with each</caption>
          <thead className="sticky top-0 bg-race-50">
            <tr>
              <th scope="col" className="px-2 py-1 text-right">Row</th>
              <th scope="col" className="px-2 py-1 text-left">Result</th>
              {mapped.map((f) => (
                <th key={f.key} scope="col" className="px-2 py-1 text-left">
                  {f.label}
                </th>
              ))}
              <th scope="col" className="px-2 py-1 text-left">Problems</th>
            </tr>
          </thead>
          <tbody>
            {rows.map((r) => {
              const bad = new Set(r.errors.map((e) => e.field));
              return (
                <tr key={r.rowNumber} className={`border-t border-line/60 ${r.outcome === 'error' ? 'bg-fault-50' : ''}`}>
                  <td className="px-2 py-1 text-right tabular-nums">{r.rowNumber}</td>
                  <td className="whitespace-nowrap px-2 py-1">{outcomeText[r.outcome]}</td>
                  {mapped.map((f) => (
                    <td key={f.key} className={`px-2 py-1 ${bad.has(f.key) ? 'font-semibold text-fault-700' : ''}`}>
                      {bad.has(f.key) ? <span aria-hidden="true">✕ </span> : null}
                      {r.values[f.key] ?? ''}
                    </td>
                  ))}
                  <td className="px-2 py-1 text-fault-700">{r.errors.map((e) => `${fields.find((f) => f.key === e.field)?.label ?? e.field}: ${e.message}`).join(' ')}</td>
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
      {(onlyProblems ? preview.counts.errorRows : preview.counts.rows) > rows.length ? (
        <p className="text-sm text-ink-soft">Showing the first {rows.length} rows.</p>
      ) : null}
    </section>
  );
}
