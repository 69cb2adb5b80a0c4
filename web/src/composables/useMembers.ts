import { shallowRef } from 'vue';
import { membersApi } from '@/api/members';
import type { Invitation, Role, User } from '@/api/types';
import { useResource } from '@/composables/useResource';

/** The team page's data: members and pending invitations, and the changes made to them. */
export function useMembers() {
  const members = shallowRef<User[]>([]);
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
    members.value = members.value.map((m) => (m.id === updated.id ? updated : m));
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

  return { members, invitations, busy, error, reload, changeRole, setActive, invite, revoke };
}
