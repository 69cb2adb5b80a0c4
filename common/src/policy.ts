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
  'brand.read': ['owner', 'admin'],
  'brand.update': ['owner', 'admin'],
  'brand.logo.upload': ['owner', 'admin'],
  'brand.logo.remove': ['owner', 'admin'],
  'brand.logo.read': ['owner', 'admin', 'engineer', 'estimator', 'viewer'],
  'billing.read': ['owner', 'admin'],
  'billing.checkout': ['owner'],
  'billing.seats': ['owner'],
  'billing.plan': ['owner'],
  'billing.cancel': ['owner'],
  'billing.resume': ['owner'],
  'billing.portal': ['owner'],
  // Issued versions and their review (one action a route: the role × route test pairs them).
  'versions.list': ['owner', 'admin', 'engineer', 'estimator', 'viewer'],
  'versions.read': ['owner', 'admin', 'engineer', 'estimator', 'viewer'],
  'versions.issue': ['owner', 'admin', 'engineer'],
  // an issued version never changes: these answer 409 to whoever may issue
  'versions.change': ['owner', 'admin', 'engineer'],
  'versions.delete': ['owner', 'admin', 'engineer'],
  'versions.send': ['owner', 'admin', 'engineer'],
  // and the member must be marked as licensed reviewer, and not the version's issuer or sender
  'versions.approve': ['owner', 'admin', 'engineer'],
  'versions.return': ['owner', 'admin', 'engineer'],
  'reviewers.mark': ['owner', 'admin'],
  'reviewers.unmark': ['owner', 'admin'],
  'audit.project': ['owner', 'admin', 'engineer', 'estimator', 'viewer'],
  'audit.firm': ['owner', 'admin', 'engineer', 'estimator', 'viewer'],
  // The proposal PDF of an issued version (one action a route).
  'proposals.list': ['owner', 'admin', 'engineer', 'estimator', 'viewer'],
  'proposals.create': ['owner', 'admin', 'engineer'],
  'proposals.read': ['owner', 'admin', 'engineer', 'estimator', 'viewer'],
  'proposals.download': ['owner', 'admin', 'engineer', 'estimator', 'viewer'],
  'proposals.send': ['owner', 'admin', 'engineer'],
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
  // the types side by side of the saved design, to a spreadsheet (Firm plan, checked in the service)
  'alternatives.export': ['owner', 'admin', 'engineer', 'estimator', 'viewer'],
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
