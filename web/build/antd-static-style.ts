// The styles of the ant-design-vue components, worked out once at build time in Node for our
// theme instead of in the browser as each component first appears. Each antd component turns its
// style objects into CSS the first time it renders (its CSS-in-JS); on the design workspace
// that held the main thread for hundreds of milliseconds per kind of component. The library's
// own static extraction (StyleProvider + extractStyle, the server-rendering path) writes the CSS
// with a map of what it holds; the browser reads the map and skips the work for every style in
// it, and works out at run time only what the map lacks.
// Run with NODE_ENV=production: the class-name hash must be the production one.
import { h } from 'vue';
import { renderToString } from 'vue/server-renderer';
import * as antd from 'ant-design-vue';
import { createCache, extractStyle, StyleProvider } from 'ant-design-vue/lib/_util/cssinjs';
import { defaultConfig, globalDesignTokenApi } from 'ant-design-vue/lib/theme/internal';
import { designTokenValue, theme } from '../src/theme';

type Comp = Parameters<typeof h>[0];
const A = antd as unknown as Record<string, Comp>;

/** The components the app uses, each rendered in the states whose styles differ. */
function everything() {
  const columns = [{ title: 'A', dataIndex: 'a', key: 'a', sorter: true }];
  const data = [{ key: 1, a: 1 }];
  const items = [{ key: 'a', title: 'A' }];
  return [
    h(A.Alert!, { message: 'm', description: 'd', showIcon: true }),
    h(A.Avatar!),
    h(A.Button!, null, () => 'b'),
    h(A.Card!, { title: 't' }, () => 'c'),
    h(A.Descriptions!, null, () => h(A.DescriptionsItem!, { label: 'l' }, () => 'v')),
    h(A.Divider!),
    h(A.Empty!),
    h(A.Form!, { layout: 'vertical' }, () =>
      h(A.FormItem!, { label: 'l', help: 'h', validateStatus: 'error' }, () => h(A.Input!)),
    ),
    h(A.Input!),
    h(A.InputPassword!),
    h(A.InputSearch!),
    h(A.Textarea!),
    h(A.InputNumber!),
    h(A.Modal!, { open: false }),
    h(A.Progress!, { percent: 50 }),
    h(A.Radio!),
    h(A.RadioGroup!, { optionType: 'button' }, () => h(A.RadioButton!, { value: 1 }, () => '1')),
    h(A.Result!, { title: 't' }),
    h(A.Segmented!, { options: ['a', 'b'], value: 'a' }),
    h(A.Select!, { options: [{ value: 1, label: '1' }] }),
    h(A.Skeleton!),
    h(A.Space!, null, () => h('span')),
    h(A.Steps!, { items, type: 'navigation', size: 'small' }),
    h(A.Steps!, { items }),
    h(A.Switch!),
    h(A.Table!, { columns, dataSource: data, rowSelection: {}, size: 'small' }),
    h(A.Tag!, { color: 'orange' }, () => 't'),
    h(A.Tooltip!, { title: 't' }, () => h('span')),
    h(A.Checkbox!),
    h(A.Spin!),
    h(A.Pagination!, { total: 50, showSizeChanger: true }),
  ];
}

/**
 * The styles as `pieces` stylesheets of about equal size, in the order antd injects them; the
 * first holds the map. Several files rather than one: the browser parses each in a task of its
 * own, and one file of all of them was a long task on a slow machine.
 */
export async function antdStaticStyle(pieces = 4): Promise<string[]> {
  const cache = createCache();
  // As web/src/main.ts does before the app mounts: the cache paths must be the page's.
  globalDesignTokenApi.value = designTokenValue(defaultConfig);
  await renderToString(
    h(StyleProvider as Comp, { cache }, () =>
      h(A.ConfigProvider!, { theme }, () => h('div', everything())),
    ),
  );
  // Not plain: each style in a <style> element of its own, so the text splits between them.
  const tagged = extractStyle(cache, false);
  const styles = [...tagged.matchAll(/<style[^>]*>([\s\S]*?)<\/style>/g)].map((m) => m[1]!);
  const map = styles.pop()!; // extractStyle puts the map last
  const total = styles.reduce((n, css) => n + css.length, 0);
  const out: string[] = [map];
  for (const css of styles) {
    const last = out.length - 1;
    if (out[last]!.length >= total / pieces && out.length < pieces) out.push(css);
    else out[last] += css;
  }
  return out;
}

// `tsx web/build/antd-static-style.ts`: the pieces as a JSON array on standard output.
if (import.meta.url === `file://${process.argv[1]}`) {
  process.stdout.write(JSON.stringify(await antdStaticStyle()));
}
