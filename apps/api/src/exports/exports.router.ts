import { Router } from 'express';
import { exportKindParamsSchema, exportQuerySchema } from '@millrace/contracts';
import type { ApiContext } from '../app-context';
import { allow } from '../auth/guard';
import { validate } from '../http/validate-request';
import { masterDataReaders } from '../master-data/roles';
import { todayIso } from '../master-data/weeks';
import { attachmentHeader } from './attachment-header';
import { exportTable } from './export-tables';
import { writeCsv } from './write-csv';
import { writeXlsx } from './write-xlsx';

const contentTypes = { csv: 'text/csv; charset=utf-8', xlsx: 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet' } as const;

/** Downloads of master data, demand and plan results as CSV or XLSX. */
export function exportsRouter({ dataSource }: ApiContext): Router {
  const router = Router();
  const input = validate({ params: exportKindParamsSchema, query: exportQuerySchema });
  router.get('/api/exports/:kind', allow(...masterDataReaders), input, async (_req, res) => {
    const { params, query } = input.from(res);
    const table = await exportTable(dataSource.manager, params.kind, query.plan);
    const body = query.format === 'csv' ? writeCsv(table) : await writeXlsx(table);
    const name = `millrace-${params.kind}${query.plan ? `-plan-${query.plan}` : ''}-${todayIso()}.${query.format}`;
    res.set('Content-Type', contentTypes[query.format]);
    res.set('Content-Disposition', attachmentHeader(name));
    res.send(body);
  });
  return router;
}
