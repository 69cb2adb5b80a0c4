import type { ThemeConfig } from 'ant-design-vue/es/config-provider/context';

// Slate neutrals (cool greys) around a deep teal primary. All styling of antd goes through
// these tokens; we never override its CSS.
export const palette = {
  teal: '#0f6e6e',
  tealDark: '#0b5454',
  tealLight: '#e6f2f1',
  slate900: '#0f172a',
  slate700: '#334155',
  slate500: '#64748b',
  slate300: '#cbd5e1',
  slate200: '#e2e8f0',
  slate100: '#f1f5f9',
  slate50: '#f8fafc',
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
    colorTextBase: palette.slate900,
    colorText: palette.slate900,
    colorTextSecondary: palette.slate500,
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
