import { importFields, workCenterCreateSchema, type WorkCenter, type WorkCenterCreate } from '@millrace/contracts';
import { deleteWorkCenterRow, insertWorkCenter, listAllWorkCenters, updateWorkCenterIfVersion } from '../../work-centers/work-centers.repository';
import { recordKind, type Flat, type StoredRecord } from './record-kind';

const keys = importFields['work-centers'].map((f) => f.key);
const patternKeys = ['shiftsPerDay', 'hoursPerShift', 'daysPerWeek', 'shiftStarts'] as const;

/** Shift start times as written in a cell: `06:00 14:00`, `06:00, 14:00` or `06:00;14:00`. */
export function splitShiftStarts(value: unknown): unknown {
  if (Array.isArray(value)) return value;
  if (typeof value !== 'string') return value;
  return value.split(/[\s,;|/]+/).filter((s) => s !== '');
}

export function workCenterFlat(w: WorkCenter): Flat {
  return {
    code: w.code,
    name: w.name,
    efficiency: w.efficiency,
    overtimeCapHoursPerWeek: w.overtimeCapHoursPerWeek,
    overtimeCostPerHour: w.overtimeCostPerHour,
    ...w.shiftPattern,
  };
}

/** Work centers by code, with their shift pattern in four columns. */
export const workCentersImport = recordKind<WorkCenterCreate>(
  {
    kind: 'work-centers',
    what: 'work center',
    async loadAll(db): Promise<StoredRecord[]> {
      return (await listAllWorkCenters(db)).map((w) => ({ id: w.id, code: w.code, version: w.version, flat: workCenterFlat(w) }));
    },
    schema: workCenterCreateSchema,
    toInput: (flat) => {
      const rest = Object.fromEntries(Object.entries(flat).filter(([k]) => !(patternKeys as readonly string[]).includes(k)));
      return {
        ...rest,
        shiftPattern: { shiftsPerDay: flat.shiftsPerDay, hoursPerShift: flat.hoursPerShift, daysPerWeek: flat.daysPerWeek, shiftStarts: splitShiftStarts(flat.shiftStarts) },
      };
    },
    fromInput: (input) => {
      const { shiftPattern, ...rest } = input;
      return { ...rest, ...shiftPattern };
    },
    insert: (db, input) => insertWorkCenter(db, input),
    update: (db, id, version, changes, merged) => {
      const rest = Object.fromEntries(Object.entries(changes).filter(([k]) => !(patternKeys as readonly string[]).includes(k)));
      const patternChanged = patternKeys.some((k) => k in changes);
      return updateWorkCenterIfVersion(db, id, { ...rest, ...(patternChanged ? { shiftPattern: merged.shiftPattern } : {}), version });
    },
    remove: (db, id) => deleteWorkCenterRow(db, id),
    nullable: ['overtimeCapHoursPerWeek'],
  },
  importFields['work-centers'],
);
