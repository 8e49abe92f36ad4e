import type { ReactNode } from 'react';

/** A chart with its title, a line on how to read it, and the same numbers as a table for screen readers. */
export function ChartFrame({ title, note, controls, table, children }: { title: string; note?: ReactNode; controls?: ReactNode; table: ReactNode; children: ReactNode }) {
  return (
    <figure className="flex flex-col gap-2 rounded border border-line bg-panel p-3">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <figcaption>
          <span className="font-semibold">{title}</span>
          {note ? <span className="block text-sm text-ink-soft">{note}</span> : null}
        </figcaption>
        {controls}
      </div>
      <div aria-hidden="true">{children}</div>
      <details>
        <summary className="cursor-pointer text-sm font-semibold text-race-700">Show these numbers as a table</summary>
        <div className="mt-2 max-h-64 overflow-auto">{table}</div>
      </details>
    </figure>
  );
}

/** A small plain table for chart data. */
export function ChartTable({ caption, head, rows }: { caption: string; head: string[]; rows: (string | number)[][] }) {
  return (
    <table className="w-full border-collapse text-sm">
      <caption className="sr-only">{caption}</caption>
      <thead>
        <tr>
          {head.map((h) => (
            <th key={h} scope="col" className="border border-line px-2 py-1 text-left">
              {h}
            </th>
          ))}
        </tr>
      </thead>
      <tbody>
        {rows.map((r, i) => (
          <tr key={i}>
            {r.map((c, j) => (
              <td key={j} className="border border-line px-2 py-1 tabular-nums">
                {c}
              </td>
            ))}
          </tr>
        ))}
      </tbody>
    </table>
  );
}
