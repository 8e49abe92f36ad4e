import type { Role } from '@millrace/contracts';

/**
 * What each role may do, mirrored from the API's guards (the API decides; the UI only hides
 * what would be refused). API.md "Roles".
 */
export type Permission =
  | 'read:master-data'
  | 'write:master-data'
  | 'read:settings'
  | 'write:settings'
  | 'manage:people'
  | 'read:outbox'
  | 'read:caught-mail'
  | 'read:demand'
  | 'write:demand'
  | 'read:plans'
  | 'write:plans'
  | 'review:plans'
  | 'read:shift-sheets';

const policy: Record<Permission, readonly Role[]> = {
  'read:master-data': ['admin', 'planner', 'supervisor'],
  'write:master-data': ['planner'],
  'read:settings': ['admin', 'planner', 'supervisor'],
  'write:settings': ['admin', 'planner'],
  'manage:people': ['admin'],
  'read:outbox': ['admin'],
  // The local mail catcher's messages (apps/api/src/dev-mail; development only).
  'read:caught-mail': ['admin'],
  'read:demand': ['admin', 'planner', 'supervisor'],
  'write:demand': ['planner'],
  // Plans, scenarios and sign-off (apps/api/src/plans, scenarios, sign-off routers).
  'read:plans': ['admin', 'planner', 'supervisor'],
  'write:plans': ['planner'],
  'review:plans': ['supervisor'],
  // Shift sheets (apps/api/src/shift-sheets): floor leads see released plans only.
  'read:shift-sheets': ['admin', 'planner', 'supervisor', 'floor_lead'],
};

export function can(role: Role | undefined, permission: Permission): boolean {
  return role !== undefined && policy[permission].includes(role);
}

export function rolesWith(permission: Permission): readonly Role[] {
  return policy[permission];
}

/** Words shown for each role. */
export const roleLabels: Record<Role, string> = {
  admin: 'Admin',
  planner: 'Planner',
  supervisor: 'Supervisor',
  floor_lead: 'Floor lead',
};
