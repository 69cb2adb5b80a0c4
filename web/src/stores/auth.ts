import { defineStore } from 'pinia';
import { computed, ref } from 'vue';
import { authApi, type SignUpBody } from '@/api/auth';
import { ApiError, setTokenSource } from '@/api/client';
import type { Firm, Role, Session, User } from '@/api/types';
import { can as policyCan, type Action } from '@/policy';

export const TOKEN_KEY = 'basinwright.token';

function readToken(): string | null {
  try {
    return localStorage.getItem(TOKEN_KEY);
  } catch {
    return null;
  }
}

function writeToken(token: string | null): void {
  try {
    if (token === null) localStorage.removeItem(TOKEN_KEY);
    else localStorage.setItem(TOKEN_KEY, token);
  } catch {
    // Storage can be blocked (private mode); the session then lasts for this tab only.
  }
}

/** The signed-in person and firm: the only server state several routes share. */
export const useAuthStore = defineStore('auth', () => {
  const token = ref<string | null>(readToken());
  const user = ref<User | null>(null);
  const firm = ref<Firm | null>(null);
  let loading: Promise<void> | null = null;

  setTokenSource(() => token.value);

  const isSignedIn = computed(() => token.value !== null);
  const isLoaded = computed(() => user.value !== null && firm.value !== null);
  const role = computed<Role | null>(() => user.value?.role ?? null);

  function can(action: Action): boolean {
    return role.value !== null && policyCan(role.value, action);
  }

  function setSession(session: Session): void {
    token.value = session.token;
    user.value = session.user;
    firm.value = session.firm;
    writeToken(session.token);
  }

  function clearSession(): void {
    token.value = null;
    user.value = null;
    firm.value = null;
    loading = null;
    writeToken(null);
  }

  /** Loads user and firm for a token kept from an earlier visit (once). */
  async function ensureLoaded(): Promise<void> {
    if (!token.value || isLoaded.value) return;
    loading ??= authApi
      .me()
      .then((me) => {
        user.value = me.user;
        firm.value = me.firm;
      })
      .catch((error: unknown) => {
        // A rejected token (401) ends the session; any other failure is the caller's to show.
        if (error instanceof ApiError && error.status === 401) clearSession();
        throw error;
      })
      .finally(() => {
        loading = null;
      });
    return loading;
  }

  async function signIn(email: string, password: string): Promise<void> {
    setSession(await authApi.signIn({ email, password }));
  }

  /** Asks for the e-mailed link that finishes a sign-up; resolves to the message to show. */
  async function signUp(body: SignUpBody): Promise<string> {
    return (await authApi.signUp(body)).message;
  }

  async function confirmSignUp(signUpToken: string): Promise<void> {
    setSession(await authApi.confirmSignUp({ token: signUpToken }));
  }

  async function resetPassword(resetToken: string, password: string): Promise<void> {
    setSession(await authApi.resetPassword({ token: resetToken, password }));
  }

  async function acceptInvitation(
    inviteToken: string,
    name: string,
    password: string,
  ): Promise<void> {
    setSession(await authApi.acceptInvitation({ token: inviteToken, name, password }));
  }

  async function updateProfile(name: string): Promise<void> {
    const me = await authApi.updateProfile({ name });
    user.value = me.user;
    firm.value = me.firm;
  }

  /** Reads the firm again (its plan and seats change through billing): the plan badge follows. */
  async function refreshFirm(): Promise<void> {
    const me = await authApi.me();
    user.value = me.user;
    firm.value = me.firm;
  }

  /** Changes the password; the server ends every other session and hands this one a new token. */
  async function changePassword(currentPassword: string, newPassword: string): Promise<void> {
    setSession(await authApi.changePassword({ currentPassword, newPassword }));
  }

  /** Ends the session on the server (best effort) and here (always). */
  async function signOut(): Promise<void> {
    try {
      if (token.value) await authApi.signOut();
    } catch {
      // The token may already be invalid; signing out locally is what matters.
    } finally {
      clearSession();
    }
  }

  return {
    token,
    user,
    firm,
    role,
    isSignedIn,
    isLoaded,
    can,
    setSession,
    clearSession,
    ensureLoaded,
    signIn,
    signUp,
    confirmSignUp,
    resetPassword,
    refreshFirm,
    acceptInvitation,
    updateProfile,
    changePassword,
    signOut,
  };
});
