import type { EntityManager } from 'typeorm';
import { workCenterIdsByPerson } from '../people/person-work-centers.repository';

/** Floor leads who get the same release e-mail: the same assigned work centers (none = every work center). */
export interface FloorLeadGroup {
  to: string[];
  /** the group's work centers by code; empty when they have none assigned */
  workCenters: Array<{ code: string; name: string }>;
}

/**
 * The active floor leads, grouped by their assigned work centers, so each release e-mail can
 * name the work centers its readers will see (leads without assignments share one e-mail).
 */
export async function floorLeadGroups(db: EntityManager): Promise<FloorLeadGroup[]> {
  const leads: { id: number; email: string }[] = await db.query("SELECT id, email FROM person WHERE role = 'floor_lead' AND active = 1 ORDER BY id");
  if (leads.length === 0) return [];
  const assigned = await workCenterIdsByPerson(
    db,
    leads.map((l) => Number(l.id)),
  );
  const centers: { id: number; code: string; name: string }[] = await db.query('SELECT id, code, name FROM work_center ORDER BY code');
  const byId = new Map(centers.map((c) => [Number(c.id), { code: c.code, name: c.name }]));
  const groups = new Map<string, FloorLeadGroup>();
  for (const lead of leads) {
    const workCenters = (assigned.get(Number(lead.id)) ?? [])
      .map((id) => byId.get(id))
      .filter((w): w is { code: string; name: string } => w !== undefined)
      .sort((a, b) => a.code.localeCompare(b.code));
    const key = workCenters.map((w) => w.code).join('\u0000');
    const group = groups.get(key) ?? { to: [], workCenters };
    group.to.push(lead.email);
    groups.set(key, group);
  }
  return [...groups.values()];
}
