import { object, string, type InferType } from 'yup';
import { HEX_COLOR, MIN_BRAND_CONTRAST, contrastWithWhite, formatContrast } from '../brand';
import { trimString } from './text';

export const BRAND_TEXT_MAX = 500;

const emptyToNull = (value: unknown): unknown => (value === '' ? null : value);

/** The firm's brand (owner, admin): colour, proposal footer, licence or seal statement. */
export const brandUpdateSchema = object({
  color: string()
    .transform(trimString)
    .transform(emptyToNull)
    .nullable()
    .optional()
    .matches(HEX_COLOR, 'Give the colour as #rrggbb, e.g. #0f6e6e.')
    .test('brand-contrast', (value, context) => {
      if (value === null || value === undefined || !HEX_COLOR.test(value)) return true;
      const ratio = contrastWithWhite(value);
      return ratio >= MIN_BRAND_CONTRAST
        ? true
        : context.createError({
            message: `White text on ${value} has a contrast of ${formatContrast(ratio)}:1; it needs at least ${MIN_BRAND_CONTRAST}:1. Choose a darker colour.`,
          });
    }),
  footer: string()
    .transform(trimString)
    .transform(emptyToNull)
    .nullable()
    .optional()
    .max(BRAND_TEXT_MAX, `Keep the footer to ${BRAND_TEXT_MAX} characters.`),
  sealStatement: string()
    .transform(trimString)
    .transform(emptyToNull)
    .nullable()
    .optional()
    .max(BRAND_TEXT_MAX, `Keep the statement to ${BRAND_TEXT_MAX} characters.`),
}).test('brand-not-empty', 'Change the colour, the footer or the statement.', (value) => {
  return (
    value.color !== undefined || value.footer !== undefined || value.sealStatement !== undefined
  );
});
export type BrandUpdateInput = InferType<typeof brandUpdateSchema>;
