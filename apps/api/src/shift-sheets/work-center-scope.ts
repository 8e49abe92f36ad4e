import type { EntityManager } from 'typeorm';
import type { Role, SheetWorkCenterScope, ShiftSheetsWeek } from '@millrace/contracts';
import { assignedWorkCenters, type AssignedWorkCenter } from '../people/person-work-centers.repository';

/** Who reads the sheets. */
export interface SheetReader {
  id: number;
  role: Role;
}

/** The work centers a reader's sheets are limited to: all of them, or a floor lead's assigned ones. */
export interface WorkCenterScope {
  kind: SheetWorkCenterScope;
  /** the assigned work centers (kind `assigned` only), by code */
  workCenters: AssignedWorkCenter[];
}

/**
 * Floor leads see the work centers they are assigned to; a floor lead with none assigned sees
 * every work center (and is told so). Everyone else sees every work center.
 */
export async function workCenterScopeOf(db: EntityManager, reader: SheetReader): Promise<WorkCenterScope> {
  if (reader.role !== 'floor_lead') return { kind: 'all', workCenters: [] };
  const assigned = await assignedWorkCenters(db, reader.id);
  return assigned.length > 0 ? { kind: 'assigned', workCenters: assigned } : { kind: 'none_assigned', workCenters: [] };
}

/**
 * A week of sheets cut to the scope: only the assigned work centers (matched by code with the
 * plan's snapshot), their cautions, their unscheduled and carried-over work, with the sheet count to match.
 * Sequencing happens before this on the whole plant, so a job's times do not depend on who reads.
 */
export function scopeSheetsWeek(week: ShiftSheetsWeek, scope: WorkCenterScope): ShiftSheetsWeek {
  if (scope.kind !== 'assigned') return { ...week, workCenterScope: scope.kind };
  const codes = new Set(scope.workCenters.map((w) => w.code));
  const workCenters = week.workCenters.filter((w) => codes.has(w.code));
  return {
    ...week,
    workCenterScope: 'assigned',
    workCenters,
    cautions: week.cautions.filter((c) => codes.has(c.workCenter)),
    unscheduled: week.unscheduled.filter((u) => codes.has(u.workCenter)),
    carriedOver: week.carriedOver.filter((c) => codes.has(c.workCenter)),
    sheetCount: workCenters.reduce((a, w) => a + w.days.reduce((b, d) => b + d.shifts.length, 0), 0),
  };
}
