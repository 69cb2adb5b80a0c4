import type { ThemeConfig } from 'ant-design-vue/es/config-provider/context';
import type { DesignTokenContext } from 'ant-design-vue/es/theme/internal';

// Slate neutrals (cool greys) around a deep teal primary. All styling of antd goes through
// these tokens; we never override its CSS. Every text colour here reads at 4.5:1 or more on
// white and on the page's grey (WCAG 2.2 AA, 1.4.3): tests/web/theme-contrast.test.ts checks
// the tokens antd derives from them.
export const palette = {
  teal: '#0f6e6e',
  tealDark: '#0b5454',
  tealLight: '#e6f2f1',
  slate900: '#0f172a',
  slate700: '#334155',
  slate600: '#475569',
  slate500: '#64748b',
  slate300: '#cbd5e1',
  slate200: '#e2e8f0',
  slate100: '#f1f5f9',
  slate50: '#f8fafc',
} as const;

/**
 * A tag's text is its colour's shade 7 on shade 1; for the lighter hues that is under 4.5:1
 * (cyan 3.39, gold 2.76). Those take a darker shade of their own palette as the text colour.
 */
const TAG_TEXT = {
  'volcano-7': '#ad2102',
  'orange-7': '#ad4e00',
  'gold-7': '#874d00',
  'yellow-7': '#876800',
  'lime-7': '#3f6600',
  'green-7': '#237804',
  'cyan-7': '#006d75',
} as const;

export const fontFamily =
  "Lato, -apple-system, 'Segoe UI', Roboto, 'Helvetica Neue', Arial, sans-serif";

export const theme: ThemeConfig = {
  token: {
    colorPrimary: palette.teal,
    colorInfo: palette.teal,
    colorLink: palette.teal,
    colorLinkHover: palette.tealDark,
    // The palette antd derives from a dark teal comes out greyish; these tints keep it teal.
    colorPrimaryBg: '#e7f3f2',
    colorPrimaryBgHover: '#d2e9e6',
    colorPrimaryBorder: '#a7d3ce',
    colorPrimaryBorderHover: '#76b8b1',
    colorPrimaryHover: '#168584',
    colorPrimaryActive: palette.tealDark,
    colorPrimaryText: palette.teal,
    colorPrimaryTextHover: '#168584',
    colorPrimaryTextActive: palette.tealDark,
    controlItemBgActive: '#e7f3f2',
    controlItemBgActiveHover: '#d2e9e6',
    controlOutline: 'rgba(15, 110, 110, 0.16)',
    // Info alerts: antd derives their fill from the teal as a dull grey (secondary text on it
    // read at 3.3:1); these are the teal tints the primary colour uses.
    colorInfoBg: '#e7f3f2',
    colorInfoBorder: '#a7d3ce',
    colorTextBase: palette.slate900,
    colorText: palette.slate900,
    // Secondary and greyed text (step titles waiting their turn, descriptions, table sorters'
    // hints): antd derives these as translucent black, 2.9:1 on the page's grey; slate 600 reads
    // at 6.9:1 there.
    colorTextSecondary: palette.slate600,
    colorTextTertiary: palette.slate600,
    colorTextDescription: palette.slate600,
    colorTextHeading: palette.slate900,
    colorTextLabel: palette.slate700,
    // Read-only designs show their values in disabled fields, and empty tables say so in the
    // disabled grey: both are text someone reads (antd's grey is 1.7:1). The grey fill still
    // marks a field as not editable.
    colorTextDisabled: palette.slate600,
    // antd's default red (#ff4d4f, 3.3:1) carries form messages and the danger links.
    colorError: '#c8221c',
    ...TAG_TEXT,
    colorBorder: palette.slate300,
    colorBorderSecondary: palette.slate200,
    colorBgLayout: palette.slate100,
    colorFillAlter: palette.slate50,
    fontFamily,
    fontSize: 14,
    borderRadius: 6,
    controlHeight: 36,
    wireframe: false,
  },
  components: {
    Menu: {
      colorItemBgSelected: '#e7f3f2',
      colorItemBgHover: palette.slate100,
      colorItemText: palette.slate700,
      colorItemTextSelected: palette.teal,
      // The side navigation draws its own edge.
      colorActiveBarBorderSize: 0,
    },
  },
};

/**
 * What antd's ConfigProvider hands its design-token context for `theme` (it has no algorithm):
 * antd's default config (seed token, hashed) with our theme over it, as its useTheme merges
 * them. ConfigProvider publishes that value as the page's global theme only once it has
 * rendered, but its own icon style is worked out before: first against antd's default theme and
 * then, when the global value arrives, again against ours: two derivations of the whole token
 * set and one style compiled in the browser, in the page's first mount. Set beforehand
 * (web/src/main.ts; the build's style extraction does the same), it is worked out once, against
 * ours, from the styles extracted at build time. `base` is antd's `defaultConfig` (from its ES
 * or CommonJS build, as the caller uses).
 */
export function designTokenValue(base: DesignTokenContext): DesignTokenContext {
  const { token, algorithm, components, ...rest } = theme;
  if (algorithm) throw new Error('designTokenValue: a theme with an algorithm is not handled');
  return {
    ...base,
    ...rest,
    components: { ...base.components, ...components },
    theme: undefined,
    token: { ...base.token, ...token },
  };
}
