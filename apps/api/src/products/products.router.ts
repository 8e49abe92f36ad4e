import { Router } from 'express';
import {
  bomReplaceSchema,
  deleteQuerySchema,
  idParamsSchema,
  productCreateSchema,
  productListQuerySchema,
  productUpdateSchema,
  routingReplaceSchema,
} from '@millrace/contracts';
import type { ApiContext } from '../app-context';
import { allow } from '../auth/guard';
import { validate } from '../http/validate-request';
import { masterDataReaders, masterDataWriters } from '../master-data/roles';
import { createProduct } from './create-product.use-case';
import { deleteProduct } from './delete-product.use-case';
import { getProductDetail } from './get-product.use-case';
import { listProducts } from './products.repository';
import { replaceBom } from './replace-bom.use-case';
import { replaceRouting } from './replace-routing.use-case';
import { updateProduct } from './update-product.use-case';

/** Products with their bills of materials and routings. */
export function productsRouter({ dataSource }: ApiContext): Router {
  const router = Router();

  const listInput = validate({ query: productListQuerySchema });
  router.get('/api/products', allow(...masterDataReaders), listInput, async (_req, res) => {
    res.json(await listProducts(dataSource.manager, listInput.from(res).query));
  });

  const getInput = validate({ params: idParamsSchema });
  router.get('/api/products/:id', allow(...masterDataReaders), getInput, async (_req, res) => {
    res.json(await getProductDetail(dataSource.manager, getInput.from(res).params.id));
  });

  const createInput = validate({ body: productCreateSchema });
  router.post('/api/products', allow(...masterDataWriters), createInput, async (_req, res) => {
    res.status(201).json(await createProduct(dataSource, createInput.from(res).body));
  });

  const updateInput = validate({ params: idParamsSchema, body: productUpdateSchema });
  router.patch('/api/products/:id', allow(...masterDataWriters), updateInput, async (_req, res) => {
    const { params, body } = updateInput.from(res);
    res.json(await updateProduct(dataSource, params.id, body));
  });

  const deleteInput = validate({ params: idParamsSchema, query: deleteQuerySchema });
  router.delete('/api/products/:id', allow(...masterDataWriters), deleteInput, async (_req, res) => {
    const { params, query } = deleteInput.from(res);
    await deleteProduct(dataSource, params.id, query.version);
    res.status(204).end();
  });

  const bomInput = validate({ params: idParamsSchema, body: bomReplaceSchema });
  router.put('/api/products/:id/bom', allow(...masterDataWriters), bomInput, async (_req, res) => {
    const { params, body } = bomInput.from(res);
    res.json(await replaceBom(dataSource, params.id, body));
  });

  const routingInput = validate({ params: idParamsSchema, body: routingReplaceSchema });
  router.put('/api/products/:id/routing', allow(...masterDataWriters), routingInput, async (_req, res) => {
    const { params, body } = routingInput.from(res);
    res.json(await replaceRouting(dataSource, params.id, body));
  });

  return router;
}
