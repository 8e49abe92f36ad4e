import { queryOptions, useQuery } from '@tanstack/react-query';
import type { PlantSettings } from '@millrace/contracts';
import { api } from '@/lib/api-client';

/** The plant's currency (from GET /api/settings), shown with money fields such as the price. */
export const getPlantCurrency = async (): Promise<PlantSettings['currency']> => (await api.get<PlantSettings>('/api/settings')).currency;

export const plantCurrencyQueryOptions = () =>
  queryOptions({ queryKey: ['products', 'plant-currency'], queryFn: getPlantCurrency, staleTime: 10 * 60_000 });

export const usePlantCurrency = () => useQuery(plantCurrencyQueryOptions());
