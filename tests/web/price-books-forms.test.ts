// The Price books page's forms (issue 9) use vee-validate with the shared schemas
// (priceItemsSchema, priceBookCreateSchema): a bad value stays as typed, the schema's message
// stands under the cell or field it is about, and nothing is sent while any is invalid.
import { afterEach, describe, expect, it, vi } from 'vitest';
import { flushPromises, mount, type VueWrapper } from '@vue/test-utils';
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

// invented rates (demo data)
const item = {
  code: 'CONC',
  description: 'Structural concrete',
  unit: 'm3',
  unitPrice: 500,
  currency: 'USD',
  source: 'Invented demo rate',
  dateNote: '2026',
};
const b1 = {
  id: 'b1',
  name: 'Invented demo rates',
  currency: 'USD',
  notes: '',
  archived: false,
  archivedAt: null,
  itemCount: 1,
  createdAt: '2026-01-01T00:00:00.000Z',
  updatedAt: '2026-01-01T00:00:00.000Z',
};

async function mountPage() {
  localStorage.setItem(TOKEN_KEY, 'tok-estimator');
  setActivePinia(createPinia());
  const api = stubApi({
    'GET /auth/me': { status: 200, body: { user: demoUser('estimator'), firm: demoFirm } },
    'GET /price-books': { status: 200, body: { items: [b1] } },
    'GET /price-books/b1': { status: 200, body: { ...b1, items: [item] } },
    'PUT /price-books/b1/items': (init) => ({
      status: 200,
      body: { ...b1, items: (JSON.parse(String(init.body)) as { items: unknown[] }).items },
    }),
  });
  const router = createAppRouter(createMemoryHistory());
  await router.push('/price-books');
  const wrapper = mount(PriceBooksView, { global: { plugins: [router] }, attachTo: document.body });
  await vi.waitFor(() => expect(wrapper.find('[data-test="item-0-code"]').exists()).toBe(true));
  await flushPromises();
  return { wrapper, api };
}

const cell = (w: Pick<VueWrapper, 'find'>, test: string) =>
  w.find<HTMLInputElement>(`input[data-test="${test}"], [data-test="${test}"] input`);
const under = (w: Pick<VueWrapper, 'find'>, test: string): string | null =>
  cell(w, test).element.closest('.ant-form-item')?.querySelector('.ant-form-item-explain-error')
    ?.textContent ?? null;
async function type(w: VueWrapper, test: string, value: string): Promise<void> {
  await cell(w, test).setValue(value);
  await cell(w, test).trigger('blur');
  await flushPromises();
}
const puts = (api: Awaited<ReturnType<typeof mountPage>>['api']) =>
  api.calls.filter((c) => c.method === 'PUT');

describe('Price books — forms', () => {
  it('a negative unit price stays as typed, is explained under its cell and is not saved', async () => {
    const { wrapper, api } = await mountPage();
    await type(wrapper, 'item-0-unitPrice', '-5');
    await vi.waitFor(() =>
      expect(under(wrapper, 'item-0-unitPrice')).toBe('A unit price cannot be negative.'),
    );
    expect(cell(wrapper, 'item-0-unitPrice').element.value).toBe('-5');
    const save = wrapper.find('[data-test="price-book-save"]');
    expect(save.attributes('disabled')).toBeDefined();
    await save.trigger('click');
    await flushPromises();
    expect(puts(api)).toHaveLength(0);
    // put right, it saves what was typed
    await type(wrapper, 'item-0-unitPrice', '512.5');
    await vi.waitFor(() => expect(under(wrapper, 'item-0-unitPrice')).toBeNull());
    await wrapper.find('[data-test="price-book-save"]').trigger('click');
    await vi.waitFor(() => expect(puts(api)).toHaveLength(1));
    const sent = JSON.parse(String(puts(api)[0]!.init.body)) as { items: { unitPrice: number }[] };
    expect(sent.items[0]!.unitPrice).toBe(512.5);
    wrapper.unmount();
  });

  it('a new item without a code, or with a code already used, is refused under its code', async () => {
    const { wrapper, api } = await mountPage();
    const add = wrapper.findAll('button').find((b) => b.text() === 'Add an item')!;
    await add.trigger('click');
    await flushPromises();
    await wrapper.find('[data-test="price-book-save"]').trigger('click');
    await flushPromises();
    await vi.waitFor(() => expect(under(wrapper, 'item-1-code')).toBe('Enter a code.'), {
      timeout: 15_000,
    });
    expect(under(wrapper, 'item-1-description')).toBe('Enter a description.');
    await type(wrapper, 'item-1-code', 'conc');
    await type(wrapper, 'item-1-description', 'Concrete again');
    // every field of the row valid, so only the repeated code is left to refuse
    await type(wrapper, 'item-1-unit', 'm3');
    await type(wrapper, 'item-1-unitPrice', '480');
    await wrapper.find('[data-test="price-book-save"]').trigger('click');
    await flushPromises();
    // a busy machine may take a while to answer the click: wait for the message, not for time
    await vi.waitFor(
      () => expect(under(wrapper, 'item-1-code')).toBe('The code conc appears more than once.'),
      { timeout: 15_000 },
    );
    expect(puts(api)).toHaveLength(0);
    wrapper.unmount();
  });

  it('a new book says what is wrong under its name and currency and is not created', async () => {
    const { wrapper, api } = await mountPage();
    await wrapper.find('[data-test="price-book-new"]').trigger('click');
    await flushPromises();
    const currency = document.querySelector<HTMLInputElement>('[data-test="new-book-currency"]')!;
    currency.value = 'US';
    currency.dispatchEvent(new Event('input'));
    currency.dispatchEvent(new Event('blur'));
    const ok = [...document.querySelectorAll<HTMLButtonElement>('.ant-modal button')].find(
      (b) => b.textContent?.trim() === 'Create',
    )!;
    ok.click();
    await vi.waitFor(() => {
      const texts = [...document.querySelectorAll('.ant-modal .ant-form-item-explain-error')].map(
        (e) => e.textContent,
      );
      expect(texts).toEqual([
        'Enter a price book name.',
        'A currency is a three-letter code such as USD or EUR.',
      ]);
    });
    expect(currency.value).toBe('US');
    expect(api.calls.filter((c) => c.method === 'POST')).toHaveLength(0);
    wrapper.unmount();
  });
});
