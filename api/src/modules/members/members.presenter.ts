import type { User } from '../../models';
import { presentUser, type UserView } from '../auth/auth.presenter';

export function presentMembers(users: User[]): { items: UserView[] } {
  return { items: users.map(presentUser) };
}

export { presentUser as presentMember };
