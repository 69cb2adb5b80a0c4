// The sign-in page: plain markup with the shared schema's messages (no form library, so the first
// page anyone loads stays light: issue 13), each message tied to its field, the server's answer
// shown above the form, a busy button, and a show/hide button for the password.
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { flushPromises, mount, type VueWrapper } from '@vue/test-utils';
import { createPinia, setActivePinia } from 'pinia';
import { createMemoryHistory, type Router } from 'vue-router';
import SignInView from '../../web/src/views/SignInView.vue';
import { createAppRouter } from '../../web/src/router';
import { TOKEN_KEY, useAuthStore } from '../../web/src/stores/auth';
import { demoFirm, demoUser, stubApi } from './fetch-stub';

// The shared schema's messages (common/src/schemas/auth.ts: emailSchema, currentPasswordSchema).
const NO_EMAIL = 'Enter an e-mail address.';
const BAD_EMAIL = 'Enter a valid e-mail address.';
const NO_PASSWORD = 'Enter your password.';

let router: Router;

beforeEach(async () => {
  setActivePinia(createPinia());
  router = createAppRouter(createMemoryHistory());
  await router.push('/sign-in?redirect=/account');
});
afterEach(() => {
  vi.unstubAllGlobals();
});

function mountPage(): VueWrapper {
  return mount(SignInView, { global: { plugins: [router] }, attachTo: document.body });
}

/** The input a <label> with exactly this text points at (as a screen reader finds it). */
function fieldLabelled(label: string): HTMLInputElement {
  const el = [...document.querySelectorAll('label')].find((l) => l.textContent?.trim() === label);
  if (!el) throw new Error(`no label ${label}`);
  const input = document.getElementById(el.htmlFor);
  if (!(input instanceof HTMLInputElement)) throw new Error(`label ${label} names no input`);
  return input;
}

/** The message the field says it is described by, or null. */
function messageOf(input: HTMLInputElement): string | null {
  const id = input.getAttribute('aria-describedby');
  return id ? (document.getElementById(id)?.textContent?.trim() ?? null) : null;
}

function submitButton(wrapper: VueWrapper) {
  const button = wrapper.findAll('button').find((b) => b.text() === 'Sign in');
  if (!button) throw new Error('no Sign in button');
  return button;
}

async function type(input: HTMLInputElement, value: string): Promise<void> {
  input.value = value;
  input.dispatchEvent(new Event('input'));
  await flushPromises();
}

const session = {
  token: 'signed-in-token',
  user: demoUser('engineer'),
  firm: demoFirm,
};

describe('SignInView', () => {
  it('names its fields "E-mail" and "Password" and its submit button "Sign in"', () => {
    const wrapper = mountPage();
    expect(fieldLabelled('E-mail').type).toBe('email');
    expect(fieldLabelled('E-mail').autocomplete).toBe('username');
    expect(fieldLabelled('Password').type).toBe('password');
    expect(fieldLabelled('Password').autocomplete).toBe('current-password');
    expect(submitButton(wrapper).attributes('type')).toBe('submit');
    // Plain markup: none of ant-design-vue's form, input or button.
    expect(wrapper.find('.ant-form, .ant-input, .ant-btn').exists()).toBe(false);
    wrapper.unmount();
  });

  it('an empty form shows the shared schema’s messages, tied to their fields, and sends nothing', async () => {
    const { calls } = stubApi({});
    const wrapper = mountPage();
    await wrapper.find('form').trigger('submit');
    const email = fieldLabelled('E-mail');
    const password = fieldLabelled('Password');
    await vi.waitFor(() => expect(messageOf(email)).toBe(NO_EMAIL));
    expect(messageOf(password)).toBe(NO_PASSWORD);
    expect(email.getAttribute('aria-invalid')).toBe('true');
    expect(password.getAttribute('aria-invalid')).toBe('true');
    // The first wrong field takes the focus, so its message is read out with it.
    expect(document.activeElement).toBe(email);
    expect(calls).toEqual([]);
    wrapper.unmount();
  });

  it('checks a field when it loses the focus, then clears the message as soon as it is right', async () => {
    const wrapper = mountPage();
    const email = fieldLabelled('E-mail');
    await type(email, 'engineer@');
    expect(messageOf(email)).toBeNull(); // nothing said while the first typing goes on
    email.dispatchEvent(new Event('blur'));
    await vi.waitFor(() => expect(messageOf(email)).toBe(BAD_EMAIL));
    await type(email, 'engineer@harrow-lune.example');
    await vi.waitFor(() => expect(messageOf(email)).toBeNull());
    expect(email.hasAttribute('aria-invalid')).toBe(false);
    wrapper.unmount();
  });

  it('signs in with the e-mail as stored (trimmed, lowercased) and goes where the visitor was going', async () => {
    const { calls } = stubApi({
      'POST /auth/login': { status: 200, body: session },
      'GET /auth/me': { status: 200, body: { user: session.user, firm: session.firm } },
    });
    const wrapper = mountPage();
    await type(fieldLabelled('E-mail'), '  Engineer@Harrow-Lune.example ');
    await type(fieldLabelled('Password'), ' basinwright-demo ');
    await wrapper.find('form').trigger('submit');
    await vi.waitFor(() => expect(router.currentRoute.value.fullPath).toBe('/account'), {
      timeout: 10_000,
    });
    const login = calls.find((c) => c.path === '/auth/login')!;
    // A password is never trimmed: spaces are part of it (common/src/schemas/auth.ts).
    expect(JSON.parse(login.init.body as string)).toEqual({
      email: 'engineer@harrow-lune.example',
      password: ' basinwright-demo ',
    });
    expect(useAuthStore().token).toBe('signed-in-token');
    expect(localStorage.getItem(TOKEN_KEY)).toBe('signed-in-token');
    wrapper.unmount();
  }, 30_000);

  it('shows the server’s refusal above the form as an alert, and the button is ready again', async () => {
    stubApi({
      'POST /auth/login': {
        status: 401,
        body: { code: 'unauthorized', message: 'Incorrect e-mail or password.' },
      },
    });
    const wrapper = mountPage();
    await type(fieldLabelled('E-mail'), 'engineer@harrow-lune.example');
    await type(fieldLabelled('Password'), 'not-the-password');
    await wrapper.find('form').trigger('submit');
    await vi.waitFor(() => expect(wrapper.find('[data-test="form-error"]').exists()).toBe(true));
    const alert = wrapper.find('[data-test="form-error"]');
    expect(alert.attributes('role')).toBe('alert');
    expect(alert.text()).toBe('Incorrect e-mail or password.');
    expect(submitButton(wrapper).attributes('aria-busy')).toBeUndefined();
    expect(router.currentRoute.value.name).toBe('sign-in');
    expect(useAuthStore().token).toBeNull();
    wrapper.unmount();
  });

  it('puts a 422’s field messages under their fields', async () => {
    stubApi({
      'POST /auth/login': {
        status: 422,
        body: {
          code: 'validation_error',
          message: 'Please check the highlighted fields.',
          details: { email: 'An e-mail address has at most 254 characters.' },
        },
      },
    });
    const wrapper = mountPage();
    await type(fieldLabelled('E-mail'), 'engineer@harrow-lune.example');
    await type(fieldLabelled('Password'), 'basinwright-demo');
    await wrapper.find('form').trigger('submit');
    await vi.waitFor(() =>
      expect(messageOf(fieldLabelled('E-mail'))).toBe(
        'An e-mail address has at most 254 characters.',
      ),
    );
    expect(messageOf(fieldLabelled('Password'))).toBeNull();
    expect(wrapper.find('[data-test="form-error"]').exists()).toBe(false);
    wrapper.unmount();
  });

  it('after too many attempts says how long to wait, from the Retry-After header', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(
        async () =>
          new Response(JSON.stringify({ code: 'rate_limited', message: 'Too many attempts.' }), {
            status: 429,
            headers: { 'Content-Type': 'application/json', 'Retry-After': '90' },
          }),
      ),
    );
    const wrapper = mountPage();
    await type(fieldLabelled('E-mail'), 'engineer@harrow-lune.example');
    await type(fieldLabelled('Password'), 'basinwright-demo');
    await wrapper.find('form').trigger('submit');
    // 90 s is 1.5 min, said as the next whole minute.
    await vi.waitFor(() =>
      expect(wrapper.find('[data-test="form-error"]').text()).toBe(
        'Too many attempts. Try again in 2 min.',
      ),
    );
    wrapper.unmount();
  });

  it('is busy while the server answers, and a second press sends nothing more', async () => {
    let answer: (r: Response) => void = () => {};
    const fetchMock = vi.fn(() => new Promise<Response>((resolve) => (answer = resolve)));
    vi.stubGlobal('fetch', fetchMock);
    const wrapper = mountPage();
    await type(fieldLabelled('E-mail'), 'engineer@harrow-lune.example');
    await type(fieldLabelled('Password'), 'basinwright-demo');
    await wrapper.find('form').trigger('submit');
    await vi.waitFor(() => expect(fetchMock).toHaveBeenCalledTimes(1));
    await flushPromises();
    expect(submitButton(wrapper).attributes('aria-busy')).toBe('true');
    expect(submitButton(wrapper).text()).toBe('Sign in'); // its name stays while it turns
    await wrapper.find('form').trigger('submit');
    await flushPromises();
    expect(fetchMock).toHaveBeenCalledTimes(1);
    answer(
      new Response(
        JSON.stringify({ code: 'unauthorized', message: 'Incorrect e-mail or password.' }),
        {
          status: 401,
          headers: { 'Content-Type': 'application/json' },
        },
      ),
    );
    await vi.waitFor(() => expect(submitButton(wrapper).attributes('aria-busy')).toBeUndefined());
    wrapper.unmount();
  });

  it('shows and hides the password with a real button that says whether it is pressed', async () => {
    const wrapper = mountPage();
    const password = fieldLabelled('Password');
    const toggle = wrapper.find('[data-test="password-toggle"]');
    // A <button> of its own: a Tab stop, pressed with Enter or Space, with a name.
    expect(toggle.element.tagName).toBe('BUTTON');
    expect(toggle.attributes('type')).toBe('button');
    expect(toggle.attributes('tabindex')).toBeUndefined();
    expect(toggle.attributes('aria-label')).toBe('Show what is typed');
    expect(toggle.attributes('aria-pressed')).toBe('false');
    await toggle.trigger('click');
    expect(password.type).toBe('text');
    expect(toggle.attributes('aria-pressed')).toBe('true');
    await toggle.trigger('click');
    expect(password.type).toBe('password');
    expect(toggle.attributes('aria-pressed')).toBe('false');
    wrapper.unmount();
  });
});
