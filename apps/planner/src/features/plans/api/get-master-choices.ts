import { queryOptions, useQuery } from '@tanstack/react-query';
import { maxPageSize, type MaterialPage, type ProductPage, type WorkCenterPage } from '@millrace/contracts';
import { api } from '@/lib/api-client';

/** Codes a scenario override can name: work centers, materials and products (read-only lists). */
export type MasterChoices = {
  workCenters: { code: string; name: string }[];
  materials: { code: string; name: string }[];
  products: { code: string; name: string }[];
};

const listParams = { pageSize: maxPageSize, sort: 'code', dir: 'asc' } as const;

export async function getMasterChoices(): Promise<MasterChoices> {
  const [w, m, p] = await Promise.all([
    api.get<WorkCenterPage>('/api/work-centers', { params: listParams }),
    api.get<MaterialPage>('/api/materials', { params: listParams }),
    api.get<ProductPage>('/api/products', { params: listParams }),
  ]);
  const pick = (items: { code: string; name: string }[]) => items.map(({ code, name }) => ({ code, name }));
  return { workCenters: pick(w.items), materials: pick(m.items), products: pick(p.items) };
}

export const masterChoicesQueryOptions = () =>
  queryOptions({ queryKey: ['scenarios', 'choices'], queryFn: getMasterChoices, staleTime: 5 * 60_000 });

export const useMasterChoices = () => useQuery(masterChoicesQueryOptions());
