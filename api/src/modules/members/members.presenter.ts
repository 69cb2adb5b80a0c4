import type { ReviewerCredential, User } from '../../models';
import { presentUser, type UserView } from '../auth/auth.presenter';
import { presentReviewer, type ReviewerView } from '../reviewers/reviewers.presenter';

/** A member on the Team page: the user and their reviewer mark (null when not a reviewer). */
export interface MemberView extends UserView {
  reviewer: ReviewerView | null;
}

export function presentMembers(
  users: User[],
  reviewers: Map<string, ReviewerCredential>,
): { items: MemberView[] } {
  return {
    items: users.map((u) => ({
      ...presentUser(u),
      reviewer: presentReviewer(reviewers.get(u.id)),
    })),
  };
}

export { presentUser as presentMember };
