import type { Role } from './schemas/limits';

/**
 * Who may do what: one table, read by the API's authorize(action) middleware, by the web app
 * to hide what a member cannot do, and by the role × route tests.
 */
export const POLICY = {
  'session.read': ['owner', 'admin', 'engineer', 'estimator', 'viewer'],
  'session.end': ['owner', 'admin', 'engineer', 'estimator', 'viewer'],
  'profile.update': ['owner', 'admin', 'engineer', 'estimator', 'viewer'],
  'password.change': ['owner', 'admin', 'engineer', 'estimator', 'viewer'],
  'members.list': ['owner', 'admin'],
  'members.update': ['owner', 'admin'],
  'invitations.list': ['owner', 'admin'],
  'invitations.create': ['owner', 'admin'],
  'invitations.revoke': ['owner', 'admin'],
  'projects.list': ['owner', 'admin', 'engineer', 'estimator', 'viewer'],
  'projects.read': ['owner', 'admin', 'engineer', 'estimator', 'viewer'],
  'projects.create': ['owner', 'admin', 'engineer'],
  'projects.update': ['owner', 'admin', 'engineer'],
  'projects.delete': ['owner', 'admin', 'engineer'],
  'designs.read': ['owner', 'admin', 'engineer', 'estimator', 'viewer'],
  'designs.write': ['owner', 'admin', 'engineer'],
  'priceBooks.list': ['owner', 'admin', 'engineer', 'estimator', 'viewer'],
  'priceBooks.read': ['owner', 'admin', 'engineer', 'estimator', 'viewer'],
  'priceBooks.export': ['owner', 'admin', 'engineer', 'estimator', 'viewer'],
  'priceBooks.create': ['owner', 'admin', 'estimator'],
  'priceBooks.update': ['owner', 'admin', 'estimator'],
  'priceBooks.items': ['owner', 'admin', 'estimator'],
  'priceBooks.copy': ['owner', 'admin', 'estimator'],
  'priceBooks.preview': ['owner', 'admin', 'estimator'],
  'priceBooks.import': ['owner', 'admin', 'estimator'],
  'takeoff.read': ['owner', 'admin', 'engineer', 'estimator', 'viewer'],
  'takeoff.write': ['owner', 'admin', 'engineer', 'estimator'],
  'estimates.list': ['owner', 'admin', 'engineer', 'estimator', 'viewer'],
  'estimates.read': ['owner', 'admin', 'engineer', 'estimator', 'viewer'],
  'estimates.export': ['owner', 'admin', 'engineer', 'estimator', 'viewer'],
  'estimates.create': ['owner', 'admin', 'engineer', 'estimator'],
  'estimates.update': ['owner', 'admin', 'engineer', 'estimator'],
  'estimates.override': ['owner', 'admin', 'engineer', 'estimator'],
  'estimates.issue': ['owner', 'admin', 'engineer', 'estimator'],
} as const satisfies Record<string, readonly Role[]>;

export type Action = keyof typeof POLICY;

export const ACTIONS = Object.keys(POLICY) as Action[];

/** True when a member with `role` may perform `action`. */
export function can(role: Role, action: Action): boolean {
  return (POLICY[action] as readonly Role[]).includes(role);
}
