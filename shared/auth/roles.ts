/**
 * Who may do what. The server's `authorize(right)` guard and the client's `can()` checks both read
 * this one table, so a button the client shows is a request the server accepts.
 */
export const ROLES = ['admin', 'builder', 'technician', 'reviewer'] as const;
export type Role = (typeof ROLES)[number];

export const ROLE_LABELS: Record<Role, string> = {
  admin: 'Admin',
  builder: 'Builder',
  technician: 'Technician',
  reviewer: 'Reviewer',
};

export const RIGHTS = [
  'conversion:read',
  'conversion:write',
  'pinmap:write',
  'feed:write',
  'checks:run',
  'calc:use',
  'worksheet:print',
  'revision:submit',
  'revision:review',
  'revision:comment',
  'bench:record',
  'library:read',
  'library:write',
  'attachment:write',
  'audit:read',
  'users:manage',
  'workshop:settings',
  'outbox:read',
] as const;
export type Right = (typeof RIGHTS)[number];

const EVERYONE: readonly Role[] = ROLES;

export const RIGHTS_BY_ROLE: Record<Right, readonly Role[]> = {
  'conversion:read': EVERYONE,
  'conversion:write': ['builder', 'admin'],
  'pinmap:write': ['builder', 'admin'],
  'feed:write': ['builder', 'admin'],
  'checks:run': EVERYONE,
  'calc:use': EVERYONE,
  'worksheet:print': EVERYONE,
  'revision:submit': ['builder', 'admin'],
  // Sign-off stays with reviewers; the separation-of-duties check (never your own submission) is
  // enforced in the review service on top of this.
  'revision:review': ['reviewer'],
  'revision:comment': ['reviewer', 'builder', 'admin'],
  'bench:record': ['technician', 'admin'],
  'library:read': EVERYONE,
  'library:write': ['builder', 'admin'],
  'attachment:write': ['builder', 'admin'],
  'audit:read': ['admin', 'reviewer', 'builder'],
  'users:manage': ['admin'],
  'workshop:settings': ['admin'],
  'outbox:read': ['admin'],
};

export function can(role: Role | undefined | null, right: Right): boolean {
  if (!role) return false;
  return RIGHTS_BY_ROLE[right].includes(role);
}
