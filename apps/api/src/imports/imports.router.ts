import { Router } from 'express';
import { importFields, importHistoryQuerySchema, importKindParamsSchema, importMappingSaveSchema, importOptionsSchema, importRunParamsSchema } from '@millrace/contracts';
import type { ApiContext } from '../app-context';
import { currentPerson } from '../auth/current-person';
import { allow } from '../auth/guard';
import { AppError } from '../http/app-error';
import { validate } from '../http/validate-request';
import { masterDataReaders, masterDataWriters } from '../master-data/roles';
import { applyImport } from './apply-import.use-case';
import { findImportFile, findSavedMapping, listImportRuns, saveMapping } from './imports.repository';
import { previewImport } from './preview-import.use-case';
import { readUpload, uploadedFile } from './read-upload';
import { undoLatestImport } from './undo-import.use-case';
import { attachmentHeader } from '../exports/attachment-header';

/**
 * Spreadsheet imports: upload for a preview, upload again to apply, history with the original
 * files, undo of the latest import of a kind, and the column mapping saved per kind.
 */
export function importsRouter({ dataSource }: ApiContext): Router {
  const router = Router();
  const db = () => dataSource.manager;

  const uploadInput = validate({ params: importKindParamsSchema, body: importOptionsSchema });
  router.post('/api/imports/:kind', allow(...masterDataWriters), readUpload, uploadInput, async (req, res) => {
    const { params, body } = uploadInput.from(res);
    res.json(await previewImport(db(), params.kind, uploadedFile(req.file), body));
  });
  router.post('/api/imports/:kind/apply', allow(...masterDataWriters), readUpload, uploadInput, async (req, res) => {
    const { params, body } = uploadInput.from(res);
    res.status(201).json(await applyImport(dataSource, params.kind, uploadedFile(req.file), body, currentPerson(res)));
  });

  const kindInput = validate({ params: importKindParamsSchema });
  router.post('/api/imports/:kind/undo', allow(...masterDataWriters), kindInput, async (_req, res) => {
    res.json(await undoLatestImport(dataSource, kindInput.from(res).params.kind, currentPerson(res)));
  });
  router.get('/api/imports/:kind/mapping', allow(...masterDataReaders), kindInput, async (_req, res) => {
    res.json(await findSavedMapping(db(), kindInput.from(res).params.kind));
  });
  const mappingInput = validate({ params: importKindParamsSchema, body: importMappingSaveSchema });
  router.put('/api/imports/:kind/mapping', allow(...masterDataWriters), mappingInput, async (_req, res) => {
    const { params, body } = mappingInput.from(res);
    const keys = new Set(importFields[params.kind].map((f) => f.key));
    const unknown = Object.keys(body.mapping).find((k) => !keys.has(k));
    if (unknown) throw AppError.validation(`The mapping names a field "${unknown}" that a ${params.kind} import does not have.`, [{ path: `mapping.${unknown}`, message: 'Not a field of this kind.' }]);
    await saveMapping(db(), params.kind, body.mapping, currentPerson(res).id);
    res.json(await findSavedMapping(db(), params.kind));
  });

  const historyInput = validate({ query: importHistoryQuerySchema });
  router.get('/api/imports', allow(...masterDataReaders), historyInput, async (_req, res) => {
    res.json(await listImportRuns(db(), historyInput.from(res).query));
  });
  const runInput = validate({ params: importRunParamsSchema });
  router.get('/api/imports/runs/:id/file', allow(...masterDataReaders), runInput, async (_req, res) => {
    const { id } = runInput.from(res).params;
    const file = await findImportFile(db(), id);
    if (!file) throw AppError.notFound(`There is no import with id ${id}.`);
    res.set('Content-Type', file.format === 'csv' ? 'text/csv; charset=utf-8' : 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet');
    res.set('Content-Disposition', attachmentHeader(file.fileName));
    res.send(file.content);
  });

  return router;
}
