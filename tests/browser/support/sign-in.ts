import { expect } from 'vitest';
import type { WatchedPage } from './watched-page';

/** Demo sign-ins (README; demo data only). */
export const demoPassword = 'millrace-demo';
export const demoPeople = {
  planner: 'planner@millrace.test',
  supervisor: 'supervisor@millrace.test',
  floorLead: 'floor@millrace.test',
  admin: 'admin@millrace.test',
} as const;

/** Signs in through the sign-in page and waits for the signed-in shell. */
export async function signIn(w: WatchedPage, email: string): Promise<void> {
  const { page } = w;
  await page.goto('/sign-in');
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(demoPassword);
  await w.shot('sign-in');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.getByRole('navigation', { name: 'Main' }).waitFor();
  // Let the home page finish loading, so a next page.goto does not cut its requests off.
  await page.waitForLoadState('networkidle');
  expect(await page.getByRole('button', { name: 'Sign out' }).isVisible()).toBe(true);
}
