// Reading ant-design-vue forms in web tests.
import type { VueWrapper } from '@vue/test-utils';

/** The error text ant-design-vue shows under the form item labelled `label`, or null. */
export function helpFor(wrapper: Pick<VueWrapper, 'findAll'>, label: string): string | null {
  const item = wrapper
    .findAll('.ant-form-item')
    .find((el) => el.find('label').exists() && el.find('label').text() === label);
  if (!item) throw new Error(`no form item labelled ${label}`);
  const explain = item.find('.ant-form-item-explain-error');
  return explain.exists() ? explain.text() : null;
}
