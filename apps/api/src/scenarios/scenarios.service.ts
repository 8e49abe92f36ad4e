import type { DataSource } from 'typeorm';
import type { Scenario, ScenarioCreate, ScenarioUpdate } from '@millrace/contracts';
import { scenarioCreateSchema } from '@millrace/contracts';
import { AppError } from '../http/app-error';
import { deleteScenario, findScenario, insertScenario, scenarioNameTaken, updateScenarioIfVersion } from './scenarios.repository';

/**
 * Scenario stories: create, change and delete what-if override sets. A scenario behind an
 * approved or released plan version is one of that plan's inputs, so it can no longer change (409).
 */
export async function createScenario(ds: DataSource, input: ScenarioCreate, personId: number): Promise<Scenario> {
  const s = scenarioCreateSchema.parse(input);
  return ds.transaction(async (db) => {
    if (await scenarioNameTaken(db, s.name, null)) throw AppError.conflict(`A scenario named "${s.name}" already exists; pick another name.`);
    const id = await insertScenario(db, { ...s, createdBy: personId });
    return (await findScenario(db, id))!;
  });
}

export async function updateScenario(ds: DataSource, id: number, input: ScenarioUpdate): Promise<Scenario> {
  return ds.transaction(async (db) => {
    const current = await findScenario(db, id, 'lock');
    if (!current) throw AppError.notFound(`Scenario ${id} does not exist.`);
    assertChangeable(current);
    if (input.name !== undefined && (await scenarioNameTaken(db, input.name, id)))
      throw AppError.conflict(`A scenario named "${input.name}" already exists; pick another name.`);
    const { version, ...changes } = input;
    if ((await updateScenarioIfVersion(db, id, version, changes)) === 'version_mismatch')
      throw AppError.conflict(`Someone else changed scenario "${current.name}" since you opened it; reload to see their change.`);
    return (await findScenario(db, id))!;
  });
}

export async function removeScenario(ds: DataSource, id: number): Promise<void> {
  await ds.transaction(async (db) => {
    const current = await findScenario(db, id, 'lock');
    if (!current) throw AppError.notFound(`Scenario ${id} does not exist.`);
    assertChangeable(current);
    await deleteScenario(db, id);
  });
}

function assertChangeable(s: Scenario): void {
  if (s.locked)
    throw AppError.conflict(
      `Scenario "${s.name}" is an input of an approved or released plan version (${s.usedByPlanIds.join(', ')}); it can no longer change. Copy it to a new scenario instead.`,
    );
}
