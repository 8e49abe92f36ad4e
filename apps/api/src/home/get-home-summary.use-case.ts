import type { DataSource } from 'typeorm';
import type { HomeQuery, HomeSummary } from '@millrace/contracts';
import { loadPlanningData } from '../planning-data/load-planning-data';
import { roughCutLoad } from './rough-cut-load';

/** The home page: the next weeks' firm demand against available hours per work center, from the current week. */
export async function getHomeSummary(dataSource: DataSource, query: HomeQuery, now?: Date): Promise<HomeSummary> {
  const data = await dataSource.transaction('REPEATABLE READ', (db) => loadPlanningData(db, query.weeks, { now }));
  return roughCutLoad(data);
}
