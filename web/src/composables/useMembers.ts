import { shallowRef } from 'vue';
import { membersApi } from '@/api/members';
import type { Invitation, Member, ReviewerMark, Role, User } from '@/api/types';
import { useResource } from '@/composables/useResource';

/** The team page's data: members and pending invitations, and the changes made to them. */
export function useMembers() {
  const members = shallowRef<Member[]>([]);
  const invitations = shallowRef<Invitation[]>([]);
  // The two lists change one by one below; a load replaces both.
  const { busy, error, reload } = useResource(
    async () => {
      const [m, i] = await Promise.all([membersApi.list(), membersApi.invitations()]);
      members.value = m.items;
      invitations.value = i.items;
    },
    { initial: undefined, what: 'the team' },
  );

  function replaceMember(updated: User): void {
    members.value = members.value.map((m) =>
      m.id === updated.id ? { ...updated, reviewer: m.reviewer } : m,
    );
  }

  function setReviewer(id: string, reviewer: ReviewerMark | null): void {
    members.value = members.value.map((m) => (m.id === id ? { ...m, reviewer } : m));
  }

  async function markReviewer(id: string, mark: ReviewerMark): Promise<ReviewerMark> {
    const saved = await membersApi.markReviewer(id, mark);
    setReviewer(id, saved);
    return saved;
  }

  async function unmarkReviewer(id: string): Promise<void> {
    await membersApi.unmarkReviewer(id);
    setReviewer(id, null);
  }

  async function changeRole(id: string, role: Role): Promise<User> {
    const updated = await membersApi.update(id, { role });
    replaceMember(updated);
    return updated;
  }

  async function setActive(id: string, active: boolean): Promise<User> {
    const updated = await membersApi.update(id, { active });
    replaceMember(updated);
    return updated;
  }

  async function invite(email: string, role: Role): Promise<Invitation> {
    const created = await membersApi.invite({ email, role });
    invitations.value = [created, ...invitations.value.filter((i) => i.id !== created.id)];
    return created;
  }

  async function revoke(id: string): Promise<void> {
    await membersApi.revokeInvitation(id);
    invitations.value = invitations.value.filter((i) => i.id !== id);
  }

  void reload();

  return {
    members,
    invitations,
    busy,
    error,
    reload,
    changeRole,
    setActive,
    invite,
    revoke,
    markReviewer,
    unmarkReviewer,
  };
}
