// Sign-up in two steps: the form asks for an e-mailed link (and says so, whatever the address),
// and the link's page finishes the sign-up and signs the owner in.
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { flushPromises, mount } from '@vue/test-utils';
import { createPinia, setActivePinia } from 'pinia';
import { createMemoryHistory } from 'vue-router';
import SignUpView from '../../web/src/views/SignUpView.vue';
import ConfirmSignUpView from '../../web/src/views/ConfirmSignUpView.vue';
import { createAppRouter } from '../../web/src/router';
import { useAuthStore } from '../../web/src/stores/auth';
import { demoFirm, demoUser, stubApi } from './fetch-stub';

const SENT = 'Check your e-mail: we have sent a link to finish creating the account.';

beforeEach(() => {
  setActivePinia(createPinia());
  localStorage.clear();
});
afterEach(() => {
  vi.unstubAllGlobals();
  document.body.innerHTML = '';
});

describe('SignUpView', () => {
  it('sends the form and then shows the server’s “check your e-mail” message, not a session', async () => {
    const { calls } = stubApi({ 'POST /auth/signup': { status: 202, body: { message: SENT } } });
    const router = createAppRouter(createMemoryHistory());
    await router.push('/sign-up');
    const wrapper = mount(SignUpView, { global: { plugins: [router] }, attachTo: document.body });
    await wrapper.find('input[autocomplete="organization"]').setValue('Tarnside Water Design');
    await wrapper.find('input[autocomplete="name"]').setValue('Ada Marsh');
    await wrapper.find('input[autocomplete="email"]').setValue('ada@tarnside.example');
    await wrapper.find('input[autocomplete="new-password"]').setValue('correct horse battery');
    await wrapper.find('form').trigger('submit');
    await vi.waitFor(() => expect(calls).toHaveLength(1), { timeout: 5000 });
    await flushPromises();
    await vi.waitFor(() => expect(wrapper.find('[data-test="sign-up-sent"]').exists()).toBe(true));
    expect(wrapper.text()).toContain(SENT);
    expect(calls.map((c) => `${c.method} ${c.path}`)).toEqual(['POST /auth/signup']);
    expect(useAuthStore().token).toBeNull();
    wrapper.unmount();
  }, 30_000);
});

describe('ConfirmSignUpView', () => {
  it('posts the link’s token, keeps the session and goes to the projects', async () => {
    const { calls } = stubApi({
      'POST /auth/signup/confirm': {
        status: 201,
        body: { token: 'new-token', user: demoUser('owner'), firm: demoFirm },
      },
      'GET /auth/me': { status: 200, body: { user: demoUser('owner'), firm: demoFirm } },
    });
    const router = createAppRouter(createMemoryHistory());
    await router.push('/confirm-sign-up?token=abc');
    const wrapper = mount(ConfirmSignUpView, {
      global: { plugins: [router] },
      attachTo: document.body,
    });
    await vi.waitFor(() => expect(router.currentRoute.value.name).toBe('projects'), {
      timeout: 15_000,
    });
    expect(JSON.parse(String(calls[0]?.init.body))).toEqual({ token: 'abc' });
    expect(useAuthStore().token).toBe('new-token');
    wrapper.unmount();
  }, 30_000);

  it('says plainly when the link no longer works', async () => {
    stubApi({
      'POST /auth/signup/confirm': {
        status: 400,
        body: { code: 'invalid_token', message: 'This link is invalid or has expired.' },
      },
    });
    const router = createAppRouter(createMemoryHistory());
    await router.push('/confirm-sign-up?token=old');
    const wrapper = mount(ConfirmSignUpView, {
      global: { plugins: [router] },
      attachTo: document.body,
    });
    await vi.waitFor(() =>
      expect(wrapper.find('[data-test="confirm-failed"]').exists()).toBe(true),
    );
    await flushPromises();
    expect(wrapper.text()).toContain('This link is invalid or has expired.');
    expect(useAuthStore().token).toBeNull();
    wrapper.unmount();
  });
});
