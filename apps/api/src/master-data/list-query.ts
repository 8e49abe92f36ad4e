import type { ObjectLiteral, SelectQueryBuilder } from 'typeorm';
import type { Page, SortDirection } from '@millrace/contracts';

export interface ListParams<S extends string> {
  page: number;
  pageSize: number;
  sort: S;
  dir: SortDirection;
  q?: string;
}

/** Escapes LIKE wildcards so a search for `50%` finds the text `50%`. */
export function likeContains(text: string): string {
  return `%${text.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
}

/**
 * Applies the text search (code or name contains `q`), sorting (by a whitelisted column, then by
 * id so pages are stable) and paging to a query builder on alias `t`, and returns one page.
 */
export async function pageFrom<T extends ObjectLiteral, S extends string, R>(
  qb: SelectQueryBuilder<T>,
  params: ListParams<S>,
  sortColumns: Record<S, string>,
  toPlain: (row: T) => R,
): Promise<Page<R>> {
  if (params.q) qb.andWhere('(t.code LIKE :q OR t.name LIKE :q)', { q: likeContains(params.q) });
  const direction = params.dir === 'desc' ? 'DESC' : 'ASC';
  qb.orderBy(sortColumns[params.sort], direction).addOrderBy('t.id', direction);
  qb.skip((params.page - 1) * params.pageSize).take(params.pageSize);
  const [rows, total] = await qb.getManyAndCount();
  return { items: rows.map(toPlain), total, page: params.page, pageSize: params.pageSize };
}
