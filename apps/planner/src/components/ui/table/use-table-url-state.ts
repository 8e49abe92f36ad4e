import { useCallback, useMemo } from 'react';
import { useSearchParams } from 'react-router-dom';
import { useUrlTextParam } from '@/lib/use-url-text-param';
import type { ColumnFiltersState, SortingState, VisibilityState } from '@tanstack/react-table';

/**
 * A table's view (search text, column filters, sorting, hidden columns) kept in the URL so a view
 * can be shared and survives a reload. The search text is typed into a local copy first. Keys: `q`, `sort=col` / `sort=-col`, `hide=a,b`,
 * `f.<column>=value`.
 */
export function useTableUrlState() {
  const [params, setParams] = useSearchParams();

  const [globalFilter, setGlobalFilter] = useUrlTextParam('q');
  const sorting: SortingState = useMemo(() => {
    const raw = params.get('sort');
    if (!raw) return [];
    return raw
      .split(',')
      .filter(Boolean)
      .map((s) => (s.startsWith('-') ? { id: s.slice(1), desc: true } : { id: s, desc: false }));
  }, [params]);
  const columnFilters: ColumnFiltersState = useMemo(() => {
    const out: ColumnFiltersState = [];
    for (const [key, value] of params) if (key.startsWith('f.') && value !== '') out.push({ id: key.slice(2), value });
    return out;
  }, [params]);
  const columnVisibility: VisibilityState = useMemo(() => {
    const hidden = (params.get('hide') ?? '').split(',').filter(Boolean);
    return Object.fromEntries(hidden.map((id) => [id, false]));
  }, [params]);

  const update = useCallback(
    (change: (next: URLSearchParams) => void) => {
      setParams(
        (prev) => {
          const next = new URLSearchParams(prev);
          change(next);
          return next;
        },
        { replace: true },
      );
    },
    [setParams],
  );

  const setSorting = useCallback(
    (value: SortingState) =>
      update((next) => {
        const text = value.map((s) => (s.desc ? `-${s.id}` : s.id)).join(',');
        if (text) next.set('sort', text);
        else next.delete('sort');
      }),
    [update],
  );
  const setColumnFilters = useCallback(
    (value: ColumnFiltersState) =>
      update((next) => {
        for (const key of [...next.keys()]) if (key.startsWith('f.')) next.delete(key);
        for (const f of value) if (f.value !== undefined && f.value !== '') next.set(`f.${f.id}`, String(f.value));
      }),
    [update],
  );
  const setColumnVisibility = useCallback(
    (value: VisibilityState) =>
      update((next) => {
        const hidden = Object.entries(value)
          .filter(([, visible]) => !visible)
          .map(([id]) => id);
        if (hidden.length) next.set('hide', hidden.join(','));
        else next.delete('hide');
      }),
    [update],
  );

  return {
    globalFilter,
    sorting,
    columnFilters,
    columnVisibility,
    setGlobalFilter,
    setSorting,
    setColumnFilters,
    setColumnVisibility,
  };
}
