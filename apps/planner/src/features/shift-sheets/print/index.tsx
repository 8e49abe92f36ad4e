import { useEffect, useMemo } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import type { Paper } from '@millrace/contracts';
import { Button } from '@/components/ui/button';
import { paths } from '@/config/paths';
import { isApiError } from '@/lib/api-client';
import { shiftSheetsPdfHref, useShiftSheets } from '../api/get-shift-sheets';
import { PrintedSheet } from './printed-sheet';

/** Paper sizes for the @page rule (landscape: the job table is wide). */
const pageSize: Record<Paper, string> = { a4: 'A4 landscape', letter: 'letter landscape' };

/**
 * The sheets of one week laid out for paper: one work center and shift per page. Print from the
 * browser (the Print button) or download the PDF, which the server prints from this same view
 * with Chromium. The root carries `data-print-state` (loading / ready / error) for that printer.
 */
export function PrintShiftSheetsPage({ planId }: { planId: number }) {
  const [params, setParams] = useSearchParams();
  const week = params.get('week') ?? undefined;
  const workCenter = params.get('workCenter') ?? undefined;
  const paper: Paper = params.get('paper') === 'letter' ? 'letter' : 'a4';
  const sheets = useShiftSheets(planId, week);
  const printedAt = useMemo(() => new Date(), []);

  useEffect(() => {
    document.title = `Shift sheets · plan version ${planId}${week ? ` · week of ${week}` : ''}${workCenter ? ` · ${workCenter}` : ''}`;
  }, [planId, week, workCenter]);

  const data = sheets.data;
  const pages = data
    ? data.workCenters
        .filter((c) => !workCenter || c.code === workCenter)
        .flatMap((c) => c.days.flatMap((d) => d.shifts))
    : [];
  const unknownWorkCenter = data && workCenter && !data.workCenters.some((c) => c.code === workCenter);
  const state = sheets.isError || unknownWorkCenter ? 'error' : data ? 'ready' : 'loading';

  return (
    <div data-print-state={state} className="print-root bg-white text-black">
      <style>{`
        @page { size: ${pageSize[paper]}; margin: 9mm 9mm 13mm 9mm; }
        @media print {
          html, body { background: #fff !important; min-width: 0 !important; }
          .printed-sheet { break-after: page; page-break-after: always; min-height: ${paper === 'a4' ? '180mm' : '186mm'}; }
          .printed-sheet:last-of-type { break-after: auto; page-break-after: auto; }
        }
        @media screen {
          .printed-sheet { box-sizing: border-box; max-width: calc(100vw - 16px); width: ${paper === 'a4' ? '279mm' : '261mm'}; min-height: ${paper === 'a4' ? '188mm' : '190mm'}; margin: 0 auto 12px; padding: 8mm; background: #fff; box-shadow: 0 0 0 1px #d9d6cc; }
        }
      `}</style>
      <div className="mx-auto flex max-w-5xl flex-wrap items-center gap-3 p-3 print:hidden">
        <Link className="text-race-700 underline" to={paths.shiftSheets.getHref(planId, week, workCenter)}>
          ← Back to the shift sheets
        </Link>
        <Button variant="primary" onClick={() => window.print()} disabled={state !== 'ready' || pages.length === 0}>
          Print
        </Button>
        {data && pages.length > 0 ? (
          <a className="rounded border border-line bg-panel px-3 py-1.5 font-semibold hover:bg-race-50" href={shiftSheetsPdfHref(planId, data.week.start, workCenter, paper)} download>
            Download PDF
          </a>
        ) : null}
        <label className="flex items-center gap-2 text-sm font-semibold">
          Paper
          <select
            className="rounded border border-line bg-panel px-2 py-1 font-normal"
            value={paper}
            onChange={(e) => {
              const next = new URLSearchParams(params);
              next.set('paper', e.target.value);
              setParams(next, { replace: true });
            }}
          >
            <option value="a4">A4</option>
            <option value="letter">Letter</option>
          </select>
        </label>
        {data ? (
          <span className="text-sm text-ink-soft">
            {pages.length} sheet{pages.length === 1 ? '' : 's'}, one work center and shift per page
          </span>
        ) : null}
      </div>

      {sheets.isPending ? <p className="p-6">Preparing the sheets…</p> : null}
      {sheets.isError ? (
        <div role="alert" className="mx-auto max-w-3xl p-6">
          <p className="font-semibold">These sheets cannot be printed.</p>
          <p>{sheets.error.message}</p>
          {isApiError(sheets.error)
            ? sheets.error.issues.map((i) => (
                <p key={i.item}>
                  {i.item}: {i.message}
                </p>
              ))
            : null}
        </div>
      ) : null}
      {unknownWorkCenter ? (
        <p role="alert" className="p-6">
          Plan version {planId} has no work center {workCenter}.
        </p>
      ) : null}
      {data && !unknownWorkCenter && pages.length === 0 ? <p className="p-6">No work is planned {workCenter ? `on ${workCenter} ` : ''}in the week of {data.week.start}: nothing to print.</p> : null}
      {data && !unknownWorkCenter
        ? pages.map((s, i) => (
            <PrintedSheet
              key={`${s.workCenter}-${s.date}-${s.shift}`}
              week={data}
              sheet={s}
              number={i + 1}
              count={pages.length}
              printedAt={printedAt}
              cautions={data.cautions.filter((c) => c.workCenter === s.workCenter && c.shift === s.shift)}
            />
          ))
        : null}
    </div>
  );
}
