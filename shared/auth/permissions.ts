/**
 * Who may do what. The server enforces this table on every route; the client reads the same table
 * only to hide controls the server would refuse.
 */

export const roles = ['admin', 'lead', 'kineticist', 'biologist', 'viewer'] as const;
export type Role = (typeof roles)[number];

export const roleLabels: Record<Role, string> = {
  admin: 'Admin',
  lead: 'Lead',
  kineticist: 'Kineticist',
  biologist: 'Biologist',
  viewer: 'Viewer',
};

export const actions = [
  /** Read every campaign, variant and measurement. */
  'read',
  /** Create and edit variants, parent enzymes, sequences and catalytic sites. */
  'variants:write',
  /** Create and edit assays, rate points, measurements and pH profiles. */
  'measurements:write',
  /** Approve, flag or retract measurements. */
  'measurements:review',
  /** Create campaigns and change their settings. */
  'campaigns:manage',
  /** Change digest settings and send digests. */
  'digests:manage',
  /** Import spreadsheets. */
  'imports:write',
  /** Manage users, roles and invitations; read the outbox. (The audit trail is readable with `read`: the Overview shows recent activity to everyone.) */
  'users:manage',
] as const;
export type Action = (typeof actions)[number];

const biologist: readonly Action[] = ['read', 'variants:write', 'imports:write'];
const kineticist: readonly Action[] = ['read', 'measurements:write', 'imports:write'];
const lead: readonly Action[] = [
  ...new Set<Action>([...biologist, ...kineticist, 'measurements:review', 'campaigns:manage', 'digests:manage']),
];

export const permissions: Record<Role, readonly Action[]> = {
  admin: actions,
  lead,
  kineticist,
  biologist,
  viewer: ['read'],
};

/** Whether a role may perform an action. */
export function can(role: Role, action: Action): boolean {
  return permissions[role].includes(action);
}
