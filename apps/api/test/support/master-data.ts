import { expect } from 'vitest';
import type { TestAgent } from './test-app';

/**
 * Small helpers that create master data through the real API (as a planner would). The values
 * passed in are the tests' own; nothing here is an expected result.
 */
export async function createWorkCenter(planner: TestAgent, body: Record<string, unknown>): Promise<{ id: number; version: number; code: string }> {
  const res = await planner.post('/api/work-centers').send({
    name: `Work center ${String(body.code)}`,
    shiftPattern: { shiftsPerDay: 1, hoursPerShift: 8, daysPerWeek: 5, shiftStarts: ['07:00'] },
    ...body,
  });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body;
}

export async function createProduct(planner: TestAgent, body: Record<string, unknown>): Promise<{ id: number; version: number; code: string }> {
  const res = await planner.post('/api/products').send({ name: `Product ${String(body.code)}`, unit: 'pcs', kind: 'finished', ...body });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body;
}

export async function createMaterial(planner: TestAgent, body: Record<string, unknown>): Promise<{ id: number; version: number; code: string }> {
  const res = await planner.post('/api/materials').send({ name: `Material ${String(body.code)}`, unit: 'kg', ...body });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body;
}

/** Row count of a table (to prove a failed save wrote nothing). */
export async function countRows(dataSource: { query(sql: string): Promise<unknown> }, table: string): Promise<number> {
  const rows = (await dataSource.query(`SELECT COUNT(*) AS n FROM \`${table}\``)) as Array<{ n: string | number }>;
  return Number(rows[0].n);
}
