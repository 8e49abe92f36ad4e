import type { EntityManager } from 'typeorm';
import type { Paper } from '@millrace/contracts';
import { AppError } from '../http/app-error';
import { getShiftSheets } from './get-shift-sheets.use-case';
import type { SheetPrinter } from './sheet-printer';
import type { SheetReader } from './work-center-scope';

export interface ShiftSheetsPdfRequest {
  planId: number;
  week?: string;
  workCenter?: string;
  paper: Paper;
  reader: SheetReader;
  /** this server's own address, where Chromium opens the print view */
  selfUrl: string;
  sessionCookie: { name: string; value: string };
  /** the built planner (which holds the print view) is served by this process */
  printViewServed: boolean;
}

/**
 * The printed sheets as a PDF: build the week's sheets first (every 403/409/422 answers before
 * Chromium starts), check the work center and that there is something to print, then let
 * Chromium print the print view with the person's own session — one page per work-center shift
 * with work, of a floor lead's assigned work centers only when they have any (the print view
 * reads the same scoped sheets).
 */
export async function renderShiftSheetsPdf(db: EntityManager, printer: SheetPrinter, req: ShiftSheetsPdfRequest): Promise<{ pdf: Buffer; filename: string; sheets: number }> {
  const week = await getShiftSheets(db, { planId: req.planId, week: req.week, reader: req.reader });
  const chosen = req.workCenter === undefined ? week.workCenters : week.workCenters.filter((w) => w.code === req.workCenter);
  if (req.workCenter !== undefined && chosen.length === 0 && week.workCenterScope === 'assigned') {
    throw new AppError(
      403,
      'forbidden',
      `Work center ${req.workCenter} is not one of your work centers (${week.workCenters.map((w) => w.code).join(', ') || 'none in this plan version'}); ask an admin to assign it to you.`,
    );
  }
  if (req.workCenter !== undefined && chosen.length === 0) {
    throw AppError.validation('The work center is not part of this plan version.', [
      { path: 'query.workCenter', message: `Plan version ${req.planId} has no work center ${req.workCenter}.` },
    ]);
  }
  const sheets = chosen.reduce((a, w) => a + w.days.reduce((b, d) => b + d.shifts.length, 0), 0);
  if (sheets === 0) {
    const who = req.workCenter === undefined ? 'No work center has' : `Work center ${req.workCenter} has no`;
    throw AppError.conflict(`${who} work in the week starting ${week.week.start} of plan version ${req.planId}; there is no sheet to print.`);
  }
  if (!req.printViewServed) {
    throw new AppError(503, 'internal_error', 'PDFs are printed from the planner’s print view, and this server does not serve the built planner (set PLANNER_DIST).');
  }
  const query = new URLSearchParams({ week: week.week.start, paper: req.paper });
  if (req.workCenter !== undefined) query.set('workCenter', req.workCenter);
  const pdf = await printer.print({ url: `${req.selfUrl}/print/shift-sheets/${req.planId}?${query}`, cookie: req.sessionCookie, paper: req.paper });
  const filename = `shift-sheets-plan-${req.planId}-${week.week.start}${req.workCenter ? `-${req.workCenter.replace(/[^A-Za-z0-9_-]/g, '_')}` : ''}.pdf`;
  return { pdf, filename, sheets };
}
