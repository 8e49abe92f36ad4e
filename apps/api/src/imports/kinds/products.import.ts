import { importFields, productCreateSchema, type Product, type ProductCreate } from '@millrace/contracts';
import { deleteProductRow, insertProduct, listAllProducts, updateProductIfVersion } from '../../products/products.repository';
import { recordKind, type Flat, type StoredRecord } from './record-kind';

const keys = importFields.products.map((f) => f.key);

export function productFlat(p: Product): Flat {
  return Object.fromEntries(keys.map((k) => [k, p[k as keyof Product]]));
}

/** Products by code: create new codes, update the mapped columns of known ones. */
export const productsImport = recordKind<ProductCreate>(
  {
    kind: 'products',
    what: 'product',
    async loadAll(db): Promise<StoredRecord[]> {
      return (await listAllProducts(db)).map((p) => ({ id: p.id, code: p.code, version: p.version, flat: productFlat(p) }));
    },
    schema: productCreateSchema,
    toInput: (flat) => flat,
    fromInput: (input) => ({ ...input }),
    insert: (db, input) => insertProduct(db, input),
    update: (db, id, version, changes) => updateProductIfVersion(db, id, { ...changes, version }),
    remove: (db, id) => deleteProductRow(db, id),
    nullable: ['family'],
  },
  importFields.products,
);
