import { Router } from 'express';
import {
  calendarReplaceSchema,
  deleteQuerySchema,
  idParamsSchema,
  workCenterCreateSchema,
  workCenterListQuerySchema,
  workCenterUpdateSchema,
} from '@millrace/contracts';
import type { ApiContext } from '../app-context';
import { allow } from '../auth/guard';
import { validate } from '../http/validate-request';
import { masterDataReaders, masterDataWriters } from '../master-data/roles';
import { createWorkCenter } from './create-work-center.use-case';
import { deleteWorkCenter } from './delete-work-center.use-case';
import { getWorkCenterDetail } from './get-work-center.use-case';
import { replaceCalendar } from './replace-calendar.use-case';
import { updateWorkCenter } from './update-work-center.use-case';
import { listWorkCenters } from './work-centers.repository';

/** Work centers with their shift patterns and weekly calendars. */
export function workCentersRouter({ dataSource }: ApiContext): Router {
  const router = Router();

  const listInput = validate({ query: workCenterListQuerySchema });
  router.get('/api/work-centers', allow(...masterDataReaders), listInput, async (_req, res) => {
    res.json(await listWorkCenters(dataSource.manager, listInput.from(res).query));
  });

  const getInput = validate({ params: idParamsSchema });
  router.get('/api/work-centers/:id', allow(...masterDataReaders), getInput, async (_req, res) => {
    res.json(await getWorkCenterDetail(dataSource.manager, getInput.from(res).params.id));
  });

  const createInput = validate({ body: workCenterCreateSchema });
  router.post('/api/work-centers', allow(...masterDataWriters), createInput, async (_req, res) => {
    res.status(201).json(await createWorkCenter(dataSource, createInput.from(res).body));
  });

  const updateInput = validate({ params: idParamsSchema, body: workCenterUpdateSchema });
  router.patch('/api/work-centers/:id', allow(...masterDataWriters), updateInput, async (_req, res) => {
    const { params, body } = updateInput.from(res);
    res.json(await updateWorkCenter(dataSource, params.id, body));
  });

  const deleteInput = validate({ params: idParamsSchema, query: deleteQuerySchema });
  router.delete('/api/work-centers/:id', allow(...masterDataWriters), deleteInput, async (_req, res) => {
    const { params, query } = deleteInput.from(res);
    await deleteWorkCenter(dataSource, params.id, query.version);
    res.status(204).end();
  });

  const calendarInput = validate({ params: idParamsSchema, body: calendarReplaceSchema });
  router.put('/api/work-centers/:id/calendar', allow(...masterDataWriters), calendarInput, async (_req, res) => {
    const { params, body } = calendarInput.from(res);
    res.json(await replaceCalendar(dataSource, params.id, body));
  });

  return router;
}
