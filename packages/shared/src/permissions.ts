import { roles, type Role } from './roles.ts';

const everyone = roles;

/**
 * The one declared role × action table. The API's `requireRole` middleware and the web app's
 * navigation both read it, and the access-control tests are generated from it, so the three
 * cannot drift apart.
 */
export const permissions = {
  /** List users, invite, change role, deactivate. */
  'users:manage': ['admin'],
  /** Read the messages held by the local mail catcher (development and demo only). */
  'mail:read': ['admin'],
  /** Read sites, strings and datasheets (owners only for their own sites). */
  'assets:read': everyone,
  /** Create and change sites, strings and datasheets. */
  'assets:write': ['admin', 'dispatcher'],
  /** Read work orders (owners: signed-off tickets of their own sites only). */
  'workOrders:read': everyone,
  /** Open tickets, one or many at once. */
  'workOrders:create': ['admin', 'dispatcher'],
  /** Assign, reassign and change due time, title, priority. */
  'workOrders:dispatch': ['admin', 'dispatcher'],
  /** Cancel a ticket before sign-off, with a reason. */
  'workOrders:cancel': ['admin', 'dispatcher'],
  /** Start and submit the work on a ticket assigned to oneself. */
  'workOrders:work': ['technician'],
  /** Sign off or return a submitted ticket. */
  'workOrders:review': ['supervisor'],
  /** Comment on a ticket. */
  'workOrders:comment': ['admin', 'dispatcher', 'technician', 'supervisor'],
  /** Record string checks and I-V traces on a ticket assigned to oneself. */
  'checks:record': ['technician'],
  /** Upload photos, record thermal findings and diode replacements on a ticket assigned to oneself. */
  'evidence:add': ['technician'],
  /** Keep the instrument register (serials, calibration dates). */
  'instruments:manage': ['admin', 'dispatcher', 'technician'],
  /** Fleet view: health map, metrics and energy at risk (owners: their own sites). */
  'fleet:read': ['admin', 'dispatcher', 'supervisor', 'owner'],
  /** CSV exports of tickets, checks and diode replacements. */
  'exports:read': ['admin', 'dispatcher', 'supervisor', 'owner'],
  /** Change the SLA hours per priority for a site. */
  'sla:manage': ['admin'],
} as const satisfies Record<string, readonly Role[]>;

export type Action = keyof typeof permissions;
export const actions = Object.keys(permissions) as Action[];

/** Whether a role may take an action. */
export function can(role: Role | null | undefined, action: Action): boolean {
  if (!role) return false;
  return (permissions[action] as readonly Role[]).includes(role);
}
