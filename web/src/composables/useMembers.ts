import { ref, shallowRef } from 'vue';
import { ApiError } from '@/api/client';
import { membersApi } from '@/api/members';
import type { Invitation, Role, User } from '@/api/types';

/** The team page's data: members and pending invitations, and the changes made to them. */
export function useMembers() {
  const members = shallowRef<User[]>([]);
  const invitations = shallowRef<Invitation[]>([]);
  const busy = ref(false);
  const error = shallowRef<ApiError | null>(null);

  async function reload(): Promise<void> {
    busy.value = true;
    error.value = null;
    try {
      const [m, i] = await Promise.all([membersApi.list(), membersApi.invitations()]);
      members.value = m.items;
      invitations.value = i.items;
    } catch (e) {
      error.value =
        e instanceof ApiError ? e : new ApiError(0, 'unknown', 'Could not load the team.');
    } finally {
      busy.value = false;
    }
  }

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
