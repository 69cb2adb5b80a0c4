import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { flushPromises, mount } from '@vue/test-utils';
import { createPinia, setActivePinia } from 'pinia';
import AccountPasswordForm from '../../web/src/components/AccountPasswordForm.vue';
import AccountProfileForm from '../../web/src/components/AccountProfileForm.vue';
import { TOKEN_KEY, useAuthStore } from '../../web/src/stores/auth';
import { demoFirm, demoUser, stubApi } from './fetch-stub';
import { helpFor } from './form-help';

async function settle(): Promise<void> {
  await flushPromises();
  await new Promise((resolve) => setTimeout(resolve, 0));
  await flushPromises();
}

beforeEach(() => {
  setActivePinia(createPinia());
  localStorage.clear();
  const auth = useAuthStore();
  auth.setSession({ token: 'old-token', user: demoUser('engineer'), firm: demoFirm });
});
afterEach(() => {
  vi.unstubAllGlobals();
});

describe('AccountPasswordForm', () => {
  it('checks the shared schema before sending (a new password under 8 characters)', async () => {
    const { calls } = stubApi({});
    const wrapper = mount(AccountPasswordForm, { attachTo: document.body });
    await wrapper
      .find('[data-test="account-current-password"] input, input[autocomplete="current-password"]')
      .setValue('whatever1');
    await wrapper.find('input[autocomplete="new-password"]').setValue('short');
    await wrapper.find('form').trigger('submit');
    await settle();
    expect(helpFor(wrapper, 'New password')).toMatch(/8/);
    expect(calls).toHaveLength(0);
    wrapper.unmount();
  });

  it("puts the server's 'current password is not right' on its field and keeps the session", async () => {
    stubApi({
      'POST /auth/change-password': {
        status: 422,
        body: {
          code: 'validation_error',
          message: 'The current password is not right.',
          details: { currentPassword: 'The current password is not right.' },
        },
      },
    });
    const wrapper = mount(AccountPasswordForm, { attachTo: document.body });
    await wrapper.find('input[autocomplete="current-password"]').setValue('not-my-password');
    await wrapper.find('input[autocomplete="new-password"]').setValue('a long new password');
    await wrapper.find('form').trigger('submit');
    await settle();
    expect(helpFor(wrapper, 'Current password')).toBe('The current password is not right.');
    expect(useAuthStore().token).toBe('old-token');
    wrapper.unmount();
  });

  it('on success the store carries the new token the server returned', async () => {
    const { calls } = stubApi({
      'POST /auth/change-password': {
        status: 200,
        body: { token: 'new-token', user: demoUser('engineer'), firm: demoFirm },
      },
    });
    const wrapper = mount(AccountPasswordForm, { attachTo: document.body });
    await wrapper.find('input[autocomplete="current-password"]').setValue('my old password');
    await wrapper.find('input[autocomplete="new-password"]').setValue('a long new password');
    await wrapper.find('form').trigger('submit');
    await settle();
    expect(JSON.parse(String(calls[0]?.init.body))).toEqual({
      currentPassword: 'my old password',
      newPassword: 'a long new password',
    });
    expect(useAuthStore().token).toBe('new-token');
    expect(localStorage.getItem(TOKEN_KEY)).toBe('new-token');
    wrapper.unmount();
  });
});

describe('AccountProfileForm', () => {
  it('sends the trimmed name and shows the saved one', async () => {
    const { calls } = stubApi({
      'PATCH /auth/me': (init) => ({
        status: 200,
        body: {
          user: { ...demoUser('engineer'), name: JSON.parse(String(init.body)).name },
          firm: demoFirm,
        },
      }),
    });
    const wrapper = mount(AccountProfileForm, { attachTo: document.body });
    await wrapper.find('input[autocomplete="name"]').setValue('  Priya Okonjo-Vale  ');
    await wrapper.find('form').trigger('submit');
    await settle();
    expect(JSON.parse(String(calls[0]?.init.body))).toEqual({ name: 'Priya Okonjo-Vale' });
    expect(useAuthStore().user?.name).toBe('Priya Okonjo-Vale');
    wrapper.unmount();
  });

  it('refuses an empty name with the schema message', async () => {
    const { calls } = stubApi({});
    const wrapper = mount(AccountProfileForm, { attachTo: document.body });
    await wrapper.find('input[autocomplete="name"]').setValue('   ');
    await wrapper.find('form').trigger('submit');
    await settle();
    expect(helpFor(wrapper, 'Name')).toBe('Enter your name.');
    expect(calls).toHaveLength(0);
    wrapper.unmount();
  });
});
