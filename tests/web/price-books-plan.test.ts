// The Price books page where the plan bites (issue 10): the plan table of the product brief
// (../shared/design/product.md, "Plans") gives Concept and Professional one book, Firm several,
// and importing from Professional up. The prompt replaces the button that would fail.
import { afterEach, describe, expect, it, vi } from 'vitest';
import { flushPromises, mount } from '@vue/test-utils';
import { createPinia, setActivePinia } from 'pinia';
import { createMemoryHistory } from 'vue-router';
import PriceBooksView from '../../web/src/views/PriceBooksView.vue';
import { createAppRouter } from '../../web/src/router';
import { TOKEN_KEY } from '../../web/src/stores/auth';
import { demoFirm, demoUser, stubApi } from './fetch-stub';

afterEach(() => {
  vi.unstubAllGlobals();
  document.body.innerHTML = '';
});

function book(id: string) {
  return {
    id,
    name: `Rates ${id}`,
    currency: 'USD',
    notes: '',
    archived: false,
    archivedAt: null,
    itemCount: 0,
    createdAt: '2026-01-01T00:00:00.000Z',
    updatedAt: '2026-01-01T00:00:00.000Z',
  };
}

async function mountFor(plan: 'concept' | 'professional' | 'firm', ids: string[]) {
  localStorage.setItem(TOKEN_KEY, 'tok-owner');
  setActivePinia(createPinia());
  const api = stubApi({
    'GET /auth/me': {
      status: 200,
      body: {
        user: demoUser('owner'),
        firm: { ...demoFirm, plan, seats: plan === 'firm' ? 3 : 1 },
      },
    },
    'GET /price-books': { status: 200, body: { items: ids.map(book) } },
    ...Object.fromEntries(
      ids.map((id) => [
        `GET /price-books/${id}`,
        { status: 200, body: { ...book(id), items: [] } },
      ]),
    ),
  });
  const router = createAppRouter(createMemoryHistory());
  await router.push('/price-books');
  const wrapper = mount(PriceBooksView, { global: { plugins: [router] }, attachTo: document.body });
  await flushPromises();
  return { wrapper, api };
}

const has = (w: Awaited<ReturnType<typeof mountFor>>['wrapper'], test: string) =>
  w.find(`[data-test="${test}"]`).exists();

describe('the Price books page and the plan', () => {
  it('Concept with its one book: prompts instead of New, Copy and Import', async () => {
    const { wrapper } = await mountFor('concept', ['a']);
    await vi.waitFor(() => expect(has(wrapper, 'price-book-items')).toBe(true));
    expect(has(wrapper, 'price-book-new')).toBe(false);
    expect(has(wrapper, 'price-book-copy')).toBe(false);
    expect(has(wrapper, 'price-book-import')).toBe(false);
    const books = wrapper.find('[data-test="price-book-limit"]').text();
    expect(books).toContain('a single price book');
    expect(books).toContain('Firm');
    const importing = wrapper.find('[data-test="price-book-import-limit"]').text();
    expect(importing).toContain('Professional');
    wrapper.unmount();
  });

  it('Professional with its one book: import offered, a second book prompted (lifted by Firm)', async () => {
    const { wrapper } = await mountFor('professional', ['a']);
    await vi.waitFor(() => expect(has(wrapper, 'price-book-items')).toBe(true));
    expect(has(wrapper, 'price-book-import')).toBe(true);
    expect(has(wrapper, 'price-book-import-limit')).toBe(false);
    expect(has(wrapper, 'price-book-new')).toBe(false);
    expect(wrapper.find('[data-test="price-book-limit"]').text()).toContain('Firm');
    wrapper.unmount();
  });

  it('Firm with two books: New, Copy and Import, and no prompt', async () => {
    const { wrapper } = await mountFor('firm', ['a', 'b']);
    await vi.waitFor(() => expect(has(wrapper, 'price-book-items')).toBe(true));
    for (const button of ['price-book-new', 'price-book-copy', 'price-book-import'])
      expect(has(wrapper, button)).toBe(true);
    expect(has(wrapper, 'upgrade-prompt')).toBe(false);
    wrapper.unmount();
  });

  it('a refusal from the server (plan changed meanwhile) shows the prompt, not an error', async () => {
    const { wrapper } = await mountFor('firm', ['a']);
    await vi.waitFor(() => expect(has(wrapper, 'price-book-copy')).toBe(true));
    const refusal = {
      code: 'plan_limit',
      message: 'The Professional plan holds a single price book. Upgrade to Firm for more.',
      details: { limit: 'priceBooks', liftedBy: 'firm' },
    };
    // From here the stand-in answers the copy with the refusal.
    stubApi({ 'POST /price-books/a/copy': { status: 403, body: refusal } });
    await wrapper.find('[data-test="price-book-copy"]').trigger('click');
    await vi.waitFor(() => expect(has(wrapper, 'price-book-limit')).toBe(true));
    expect(wrapper.find('[data-test="price-book-limit"]').text()).toContain(refusal.message);
    expect(has(wrapper, 'price-book-new')).toBe(false);
    wrapper.unmount();
  });
});
