// POST /calc/uncertainty and the web's Uncertainty panel: the study input (in its own units)
// and the uncertain inputs with their spreads. A factor multiplies a design value; a depth is in
// the input's length unit (m or ft). Bounds: UNCERTAINTY_LIMITS; the engine checks the physics.
import { array, number, object, string, type Schema } from 'yup';
import { DISTRIBUTION_KINDS, type Distribution } from '../uncertainty/distributions';
import { UNCERTAIN_KEYS, type UncertainInput } from '../uncertainty/inputs';
import type { UncertaintyRequest } from '../uncertainty/run';
import type { StudyInput } from '../range/types';
import { UNCERTAINTY_LIMITS } from './limits';
import { studyInputSchema } from './study';

const num = (label: string) =>
  number()
    .typeError(`The ${label} must be a number.`)
    .test(
      'finite',
      `The ${label} must be a finite number.`,
      (v) => v === undefined || Number.isFinite(v),
    );

/** 0.99 → "99 %" */
const pct = (fraction: number): string => `${Math.round(fraction * 100)} %`;

const distributionSchema = object({
  kind: string()
    .oneOf([...DISTRIBUTION_KINDS], 'The distribution must be uniform, triangular or normal.')
    .required('Choose a distribution.'),
  low: num('low value').required('Enter the low value.'),
  high: num('high value')
    .required('Enter the high value.')
    .test('order', 'The high value must not be below the low value.', function (high) {
      const low = (this.parent as { low?: number }).low;
      return low === undefined || high === undefined || high >= low;
    }),
  mode: num('most likely value').when('kind', ([kind], s) =>
    kind === 'triangular' ? s.required('Enter the most likely value.') : s.strip(),
  ),
  mean: num('mean').when('kind', ([kind], s) =>
    kind === 'normal' ? s.required('Enter the mean.') : s.strip(),
  ),
  sd: num('standard deviation').when('kind', ([kind], s) =>
    kind === 'normal'
      ? s
          .min(0, 'The standard deviation must not be negative.')
          .required('Enter the standard deviation.')
      : s.strip(),
  ),
}) as unknown as Schema<Distribution>;

export const uncertainInputSchema = object({
  key: string()
    .oneOf([...UNCERTAIN_KEYS], `The uncertain input must be one of: ${UNCERTAIN_KEYS.join(', ')}.`)
    .required('Choose the uncertain input.'),
  distribution: distributionSchema,
  basis: string()
    .max(
      UNCERTAINTY_LIMITS.maxBasisLength,
      `The basis must be at most ${UNCERTAINTY_LIMITS.maxBasisLength} characters.`,
    )
    .default(''),
}) as unknown as Schema<UncertainInput>;

export const uncertaintySpecSchema = object({
  inputs: array(uncertainInputSchema)
    .max(UNCERTAIN_KEYS.length, `At most ${UNCERTAIN_KEYS.length} uncertain inputs.`)
    .required('List the uncertain inputs.'),
  samples: num('number of samples')
    .integer('The number of samples must be a whole number.')
    .min(1, 'Draw at least one sample.')
    .max(UNCERTAINTY_LIMITS.maxSamples, `At most ${UNCERTAINTY_LIMITS.maxSamples} samples.`)
    .required('Enter the number of samples.'),
  seed: string().max(100, 'The seed must be at most 100 characters.').required('Enter a seed.'),
  // said both as the fraction sent and as the percentage a form shows
  confidence: num('confidence')
    .min(
      UNCERTAINTY_LIMITS.confidence.min,
      `The confidence must be at least ${UNCERTAINTY_LIMITS.confidence.min} (${pct(UNCERTAINTY_LIMITS.confidence.min)}).`,
    )
    .max(
      UNCERTAINTY_LIMITS.confidence.max,
      `The confidence must not exceed ${UNCERTAINTY_LIMITS.confidence.max} (${pct(UNCERTAINTY_LIMITS.confidence.max)}).`,
    )
    .required('Enter the confidence.'),
}) as unknown as Schema<UncertaintyRequest>;

/** The whole request: the design's study input and the uncertainty run. */
export const uncertaintyRequestSchema = object({
  input: studyInputSchema.required('Enter the study input.'),
  uncertainty: uncertaintySpecSchema,
}) as unknown as Schema<{ input: StudyInput; uncertainty: UncertaintyRequest }>;
