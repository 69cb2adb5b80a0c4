// What a member gains or loses when their role changes, read from the one action × role table
// (common/src/policy.ts). Each ability below gathers the actions that go together in the
// product; tests/web/role-change.test.ts checks that every action not open to all roles is in
// exactly one ability, and that an ability's actions are allowed to the same roles.
import type { Role } from '@basinwright/common';
import { can, type Action } from '@/policy';

export interface Ability {
  /** plain words, completing "may …" */
  label: string;
  actions: readonly Action[];
}

export const ABILITIES: readonly Ability[] = [
  {
    label: 'see and manage the team (roles, access, invitations)',
    actions: [
      'members.list',
      'members.update',
      'invitations.list',
      'invitations.create',
      'invitations.revoke',
    ],
  },
  { label: 'mark members as licensed reviewers', actions: ['reviewers.mark', 'reviewers.unmark'] },
  {
    label: 'create, edit and delete projects',
    actions: ['projects.create', 'projects.update', 'projects.delete'],
  },
  { label: 'edit designs', actions: ['designs.write'] },
  {
    label:
      'issue versions, send them for review, and approve or return them when marked as reviewer',
    actions: [
      'versions.issue',
      'versions.change',
      'versions.delete',
      'versions.send',
      'versions.approve',
      'versions.return',
    ],
  },
  {
    label: 'make proposals and send them to clients',
    actions: ['proposals.create', 'proposals.send'],
  },
  { label: 'change take-off assumptions', actions: ['takeoff.write'] },
  {
    label: 'start, change and issue estimates',
    actions: ['estimates.create', 'estimates.update', 'estimates.override', 'estimates.issue'],
  },
  {
    label: 'create, edit, copy and import price books',
    actions: [
      'priceBooks.create',
      'priceBooks.update',
      'priceBooks.items',
      'priceBooks.copy',
      'priceBooks.preview',
      'priceBooks.import',
    ],
  },
  {
    label: "see and change the firm's brand",
    actions: ['brand.read', 'brand.update', 'brand.logo.upload', 'brand.logo.remove'],
  },
  { label: 'see billing', actions: ['billing.read'] },
  {
    label: 'pay for the plan and change its seats, plan and payment details',
    actions: [
      'billing.checkout',
      'billing.seats',
      'billing.plan',
      'billing.cancel',
      'billing.resume',
      'billing.portal',
    ],
  },
];

/** True when `role` may do everything the ability gathers. */
export const hasAbility = (role: Role, ability: Ability): boolean =>
  ability.actions.every((action) => can(role, action));

/** The abilities a member gains and loses going from one role to another. */
export function roleChangeEffects(from: Role, to: Role): { gains: string[]; losses: string[] } {
  return {
    gains: ABILITIES.filter((a) => hasAbility(to, a) && !hasAbility(from, a)).map((a) => a.label),
    losses: ABILITIES.filter((a) => hasAbility(from, a) && !hasAbility(to, a)).map((a) => a.label),
  };
}
