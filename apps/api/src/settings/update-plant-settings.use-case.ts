import type { DataSource } from 'typeorm';
import type { PlantSettings, PlantSettingsUpdate } from '@millrace/contracts';
import { AppError } from '../http/app-error';
import { changedSinceOpened } from '../master-data/conflict-messages';
import { countWeekDatedRows, readPlantSettings, writePlantSettings } from './settings.repository';

/**
 * An admin or planner saves the plant settings: the version must match; the week start day can
 * only change while no demand, calendar week or receipt is stored against the old week starts.
 */
export async function updatePlantSettings(dataSource: DataSource, input: PlantSettingsUpdate): Promise<PlantSettings> {
  return dataSource.transaction(async (db) => {
    const current = await readPlantSettings(db);
    if (current.version !== input.version) throw changedSinceOpened('the plant settings');
    if (input.weekStart !== current.weekStart) {
      const dated = await countWeekDatedRows(db);
      if (dated > 0) {
        throw new AppError(409, 'conflict', `The week start cannot change while ${dated} demand, calendar or receipt rows are stored on weeks starting ${current.weekStart}.`, {
          fields: [{ path: 'weekStart', message: `Weeks already start on ${current.weekStart} in stored data.` }],
        });
      }
    }
    if ((await writePlantSettings(db, input)) === 'version_mismatch') throw changedSinceOpened('the plant settings');
    return readPlantSettings(db);
  });
}
