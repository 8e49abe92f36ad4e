import { queryOptions, useQuery } from '@tanstack/react-query';
import type { ImportRun } from '@millrace/contracts';
import { api } from '@/lib/api-client';

/** GET /api/imports: applied imports, newest first, with their original files. */
export const getImportRuns = (): Promise<ImportRun[]> => api.get<ImportRun[]>('/api/imports');

export const importRunsQueryOptions = () => queryOptions({ queryKey: ['imports', 'runs'], queryFn: getImportRuns });

export const useImportRuns = () => useQuery(importRunsQueryOptions());
