import { Router, type Request } from 'express';
import { planIdParamsSchema, shiftSheetsPdfQuerySchema, shiftSheetsQuerySchema } from '@millrace/contracts';
import type { ApiContext } from '../app-context';
import { currentPerson } from '../auth/current-person';
import { allow } from '../auth/guard';
import { validate } from '../http/validate-request';
import { getShiftSheets } from './get-shift-sheets.use-case';
import { renderShiftSheetsPdf } from './render-shift-sheets-pdf.use-case';
import { readableStates } from './sheet-access';
import { sheetPrinterFor } from './sheet-printer';
import { listPlansInStates } from './shift-sheets.repository';

/** The address this request came in on (loopback in practice): Chromium opens the print view there. */
function selfUrl(req: Request): string {
  const address = req.socket.localAddress ?? '127.0.0.1';
  const host = address.startsWith('::ffff:') ? address.slice(7) : address.includes(':') ? `[${address}]` : address;
  return `http://${host}:${req.socket.localPort}`;
}

/**
 * Shift sheets: the plan versions with sheets the person may read, one week of sheets as JSON,
 * and the same week printed to PDF. Planners, supervisors and admins read approved and released
 * plan versions; floor leads released ones only, and only their assigned work centers when
 * they have any.
 */
export function shiftSheetsRouter(ctx: ApiContext): Router {
  const router = Router();
  const db = () => ctx.dataSource.manager;
  const readers = ['planner', 'supervisor', 'admin', 'floor_lead'] as const;
  const week = validate({ params: planIdParamsSchema, query: shiftSheetsQuerySchema });
  const pdf = validate({ params: planIdParamsSchema, query: shiftSheetsPdfQuerySchema });

  router.get('/api/shift-sheets/plans', allow(...readers), async (_req, res) => {
    res.json(await listPlansInStates(db(), readableStates(currentPerson(res).role)));
  });
  router.get('/api/plans/:id/shift-sheets', allow(...readers), week, async (_req, res) => {
    const { params, query } = week.from(res);
    res.json(await getShiftSheets(db(), { planId: params.id, week: query.week, reader: currentPerson(res) }));
  });
  router.get('/api/plans/:id/shift-sheets.pdf', allow(...readers), pdf, async (req, res) => {
    const { params, query } = pdf.from(res);
    const out = await renderShiftSheetsPdf(db(), sheetPrinterFor(ctx.config.chromiumPath), {
      planId: params.id,
      week: query.week,
      workCenter: query.workCenter,
      paper: query.paper,
      reader: currentPerson(res),
      selfUrl: selfUrl(req),
      sessionCookie: { name: ctx.lucia.sessionCookieName, value: res.locals.auth!.sessionId! },
      printViewServed: Boolean(ctx.config.plannerDist),
    });
    res.attachment(out.filename).type('application/pdf').set('X-Sheet-Count', String(out.sheets)).send(out.pdf);
  });
  return router;
}
