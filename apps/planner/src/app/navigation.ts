import type { Role } from '@millrace/contracts';
import { paths } from '@/config/paths';
import { rolesWith } from '@/lib/authorization';

/**
 * The navigation, per role. A new feature adds one entry here and one route in router.tsx; the
 * route's `handle.roles` and these roles must agree (the API decides; this only mirrors it).
 */
export type NavItem = { label: string; href: string; roles: readonly Role[] };

export const navItems: readonly NavItem[] = [
  { label: 'Home', href: paths.home.getHref(), roles: ['admin', 'planner', 'supervisor', 'floor_lead'] },
  { label: 'Products', href: paths.products.getHref(), roles: rolesWith('read:master-data') },
  { label: 'Work centers', href: paths.workCenters.getHref(), roles: rolesWith('read:master-data') },
  { label: 'Materials', href: paths.materials.getHref(), roles: rolesWith('read:master-data') },
  { label: 'Demand', href: paths.demand.getHref(), roles: rolesWith('read:demand') },
  { label: 'Plans', href: paths.plans.getHref(), roles: rolesWith('read:plans') },
  { label: 'Shift sheets', href: paths.shiftSheets.getHref(), roles: rolesWith('read:shift-sheets') },
  { label: 'Imports', href: paths.imports.getHref(), roles: rolesWith('write:master-data') },
  { label: 'People', href: paths.people.getHref(), roles: rolesWith('manage:people') },
  { label: 'Plant settings', href: paths.settings.getHref(), roles: rolesWith('read:settings') },
  { label: 'Mail', href: paths.mail.getHref(), roles: rolesWith('read:outbox') },
  { label: 'Caught mail', href: paths.caughtMail.getHref(), roles: rolesWith('read:caught-mail') },
];

export function navItemsFor(role: Role): NavItem[] {
  return navItems.filter((item) => item.roles.includes(role));
}
