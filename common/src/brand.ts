/**
 * Contrast of a brand colour against white text, by the WCAG 2.x definitions: relative
 * luminance L = 0.2126 R + 0.7152 G + 0.0722 B of the linearised sRGB channels
 * (c ≤ 0.03928 ? c / 12.92 : ((c + 0.055) / 1.055)^2.4), and contrast ratio
 * (L_lighter + 0.05) / (L_darker + 0.05), from 1 (none) to 21 (black on white).
 */

/** The least contrast between white text and the brand colour behind it (WCAG 2.x AA, normal text). */
export const MIN_BRAND_CONTRAST = 4.5;

export const HEX_COLOR = /^#[0-9a-fA-F]{6}$/;

function channel(hex: string, at: number): number {
  const c = parseInt(hex.slice(at, at + 2), 16) / 255;
  return c <= 0.03928 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
}

/** Relative luminance of a #rrggbb colour (0 black … 1 white). Throws RangeError on another form. */
export function relativeLuminance(hex: string): number {
  if (!HEX_COLOR.test(hex)) throw new RangeError(`Not a #rrggbb colour: ${hex}`);
  return 0.2126 * channel(hex, 1) + 0.7152 * channel(hex, 3) + 0.0722 * channel(hex, 5);
}

/** Contrast ratio of two #rrggbb colours (1 … 21). */
export function contrastRatio(a: string, b: string): number {
  const [la, lb] = [relativeLuminance(a), relativeLuminance(b)];
  return (Math.max(la, lb) + 0.05) / (Math.min(la, lb) + 0.05);
}

/** Contrast of white text on `hex`. */
export function contrastWithWhite(hex: string): number {
  return contrastRatio(hex, '#ffffff');
}

/** The ratio as the user reads it: two decimals, rounded down so 4.499 never reads 4.50. */
export function formatContrast(ratio: number): string {
  return (Math.floor(ratio * 100) / 100).toFixed(2);
}

/** Logo uploads: at most 1 MB, PNG or JPEG by content, at most 4000 × 4000 pixels. */
export const LOGO_LIMITS = {
  maxBytes: 1024 * 1024,
  maxWidth: 4000,
  maxHeight: 4000,
  /** The stored copy is re-encoded to fit within this box (pixels). */
  storedMaxSide: 1024,
  /** Sizes the logo is served at (the longer side, pixels). */
  servedSizes: [64, 128, 256, 512] as const,
} as const;
