// Text contrast through the theme (WCAG 2.2 AA, success criterion 1.4.3: at least 4.5:1 for
// normal text). The tokens are read as ant-design-vue derives them from web/src/theme.ts (its
// own algorithm, inside a config provider), and each text colour is checked on the backgrounds
// it is drawn on; the ratio is the WCAG 2.x relative-luminance formula in common/src/brand.ts.
import { describe, expect, it } from 'vitest';
import { defineComponent, h } from 'vue';
import { mount } from '@vue/test-utils';
import { ConfigProvider, theme as antTheme } from 'ant-design-vue';
import type { GlobalToken } from 'ant-design-vue/es/theme';
import { contrastRatio } from '../../common/src/brand';
import { theme } from '../../web/src/theme';

const AA = 4.5; // WCAG 2.2, 1.4.3 Contrast (Minimum)

/** #rrggbb of a token, a translucent colour laid over `under` as the browser composes it. */
function solid(colour: string, under = '#ffffff'): string {
  if (/^#[0-9a-f]{3}$/i.test(colour)) return solid(colour.replace(/[0-9a-f]/gi, '$&$&'), under);
  if (/^#[0-9a-f]{6}$/i.test(colour)) return colour.toLowerCase();
  const m = /^rgba?\((\d+),\s*(\d+),\s*(\d+)(?:,\s*([\d.]+))?\)$/.exec(colour);
  if (!m) throw new Error(`unreadable colour ${colour}`);
  const a = m[4] === undefined ? 1 : Number(m[4]);
  const base = [1, 3, 5].map((i) => parseInt(under.slice(i, i + 2), 16));
  return `#${[m[1], m[2], m[3]]
    .map((c, i) => Math.round(a * Number(c) + (1 - a) * base[i]!))
    .map((c) => c.toString(16).padStart(2, '0'))
    .join('')}`;
}

function derivedTokens(config: typeof theme): GlobalToken {
  let token: GlobalToken | undefined;
  const Probe = defineComponent({
    setup() {
      token = antTheme.useToken().token.value;
      return () => null;
    },
  });
  mount(ConfigProvider, { props: { theme: config }, slots: { default: () => h(Probe) } }).unmount();
  if (!token) throw new Error('no token read');
  return token;
}

const TAG_COLOURS = [
  'volcano',
  'orange',
  'gold',
  'yellow',
  'lime',
  'green',
  'cyan',
  'blue',
  'geekblue',
  'purple',
  'magenta',
  'red',
] as const;

describe('theme: text contrast at least 4.5:1', () => {
  const token = derivedTokens(theme);
  const ratio = (text: string, bg: string) => contrastRatio(solid(text, bg), solid(bg));

  it('secondary and greyed text on white, the page grey, the table header and the alert fills', () => {
    for (const key of [
      'colorText',
      'colorTextSecondary',
      'colorTextTertiary',
      'colorTextDescription',
      'colorTextLabel',
      'colorTextHeading',
    ] as const) {
      // …and on the fills of the alerts they sit in (the plan prompts' second line is muted)
      for (const bg of [
        token.colorBgContainer,
        token.colorBgLayout,
        token.colorFillAlter,
        token.colorInfoBg,
        token.colorWarningBg,
        token.colorErrorBg,
        token.colorSuccessBg,
      ]) {
        expect(ratio(token[key], bg), `${key} ${token[key]} on ${bg}`).toBeGreaterThanOrEqual(AA);
      }
    }
  });

  it('values in read-only (disabled) fields and the words of an empty table', () => {
    expect(ratio(token.colorTextDisabled, token.colorBgContainerDisabled)).toBeGreaterThanOrEqual(
      AA,
    );
    expect(ratio(token.colorTextDisabled, token.colorBgContainer)).toBeGreaterThanOrEqual(AA);
  });

  it('links, the primary colour and error messages on white', () => {
    for (const key of [
      'colorLink',
      'colorPrimary',
      'colorPrimaryText',
      'colorError',
      'colorErrorText',
    ] as const) {
      expect(
        ratio(token[key], token.colorBgContainer),
        `${key} ${token[key]}`,
      ).toBeGreaterThanOrEqual(AA);
    }
    // the primary button's white text on the primary colour
    expect(ratio(token.colorTextLightSolid, token.colorPrimary)).toBeGreaterThanOrEqual(AA);
  });

  it('every preset tag colour: its text (shade 7) on its background (shade 1)', () => {
    const t = token as unknown as Record<string, string>;
    for (const c of TAG_COLOURS) {
      expect(ratio(t[`${c}-7`]!, t[`${c}-1`]!), `${c} tag`).toBeGreaterThanOrEqual(AA);
    }
  });

  it('the check against antd’s own defaults fails (the test can fail)', () => {
    // Without our tokens the cyan tag reads at 3.39:1 and greyed text at about 2.9:1 on the grey.
    const plain = derivedTokens({});
    const p = plain as unknown as Record<string, string>;
    expect(ratio(p['cyan-7']!, p['cyan-1']!)).toBeLessThan(AA);
    expect(ratio(plain.colorTextDescription, token.colorBgLayout)).toBeLessThan(AA);
  });
});
