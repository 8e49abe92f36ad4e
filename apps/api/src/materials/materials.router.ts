import { Router } from 'express';
import {
  deleteQuerySchema,
  idParamsSchema,
  materialCreateSchema,
  materialListQuerySchema,
  materialUpdateSchema,
  receiptsReplaceSchema,
} from '@millrace/contracts';
import type { ApiContext } from '../app-context';
import { allow } from '../auth/guard';
import { validate } from '../http/validate-request';
import { masterDataReaders, masterDataWriters } from '../master-data/roles';
import { createMaterial } from './create-material.use-case';
import { deleteMaterial } from './delete-material.use-case';
import { getMaterialDetail } from './get-material.use-case';
import { listMaterials } from './materials.repository';
import { replaceMaterialReceipts } from './replace-receipts.use-case';
import { updateMaterial } from './update-material.use-case';

/** Purchased materials with their scheduled receipts. */
export function materialsRouter({ dataSource }: ApiContext): Router {
  const router = Router();

  const listInput = validate({ query: materialListQuerySchema });
  router.get('/api/materials', allow(...masterDataReaders), listInput, async (_req, res) => {
    res.json(await listMaterials(dataSource.manager, listInput.from(res).query));
  });

  const getInput = validate({ params: idParamsSchema });
  router.get('/api/materials/:id', allow(...masterDataReaders), getInput, async (_req, res) => {
    res.json(await getMaterialDetail(dataSource.manager, getInput.from(res).params.id));
  });

  const createInput = validate({ body: materialCreateSchema });
  router.post('/api/materials', allow(...masterDataWriters), createInput, async (_req, res) => {
    res.status(201).json(await createMaterial(dataSource, createInput.from(res).body));
  });

  const updateInput = validate({ params: idParamsSchema, body: materialUpdateSchema });
  router.patch('/api/materials/:id', allow(...masterDataWriters), updateInput, async (_req, res) => {
    const { params, body } = updateInput.from(res);
    res.json(await updateMaterial(dataSource, params.id, body));
  });

  const deleteInput = validate({ params: idParamsSchema, query: deleteQuerySchema });
  router.delete('/api/materials/:id', allow(...masterDataWriters), deleteInput, async (_req, res) => {
    const { params, query } = deleteInput.from(res);
    await deleteMaterial(dataSource, params.id, query.version);
    res.status(204).end();
  });

  const receiptsInput = validate({ params: idParamsSchema, body: receiptsReplaceSchema });
  router.put('/api/materials/:id/receipts', allow(...masterDataWriters), receiptsInput, async (_req, res) => {
    const { params, body } = receiptsInput.from(res);
    res.json(await replaceMaterialReceipts(dataSource, params.id, body));
  });

  return router;
}
