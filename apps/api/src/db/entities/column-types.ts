import type { ValueTransformer } from 'typeorm';

/**
 * mysql2 returns DECIMAL columns as strings (exact); master data uses them as plain numbers.
 * Quantities here carry at most 6 decimals and stay far below 2^53, so a double is exact enough.
 */
export const decimalAsNumber: ValueTransformer = {
  to: (value: number | null | undefined) => value,
  from: (value: string | number | null) => (value === null || value === undefined ? value : Number(value)),
};

/** A list of clock times kept as `06:00,14:00` in one VARCHAR column. */
export const clockTimeList: ValueTransformer = {
  to: (value: string[] | undefined) => (value === undefined ? value : value.join(',')),
  from: (value: string | null) => (value ? value.split(',') : []),
};
