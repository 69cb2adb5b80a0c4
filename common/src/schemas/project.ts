import { number, object, string, type InferType } from 'yup';
import { trimString } from './text';
import {
  LIMITS,
  PROJECT_SORTS,
  PROJECT_STATUSES,
  PROJECT_UNITS,
  SORT_ORDERS,
  type ProjectSort,
  type ProjectStatus,
  type ProjectUnits,
  type SortOrder,
} from './limits';

// Free-text fields: null from a cleared form field means "empty".
const text = (max: number, label: string) =>
  string()
    .transform((value: unknown, original: unknown) => (original === null ? '' : value))
    .transform(trimString)
    .max(max, `${label} has at most ${max} characters.`);

const projectName = string()
  .transform(trimString)
  .min(1, 'Enter a project name.')
  .max(
    LIMITS.projectNameMaxLength,
    `A project name has at most ${LIMITS.projectNameMaxLength} characters.`,
  );
const units = string<ProjectUnits>().oneOf(PROJECT_UNITS, 'Choose SI or US customary units.');
const status = string<ProjectStatus>().oneOf(
  PROJECT_STATUSES,
  'Choose one of: draft, in review, issued, archived.',
);

export const projectCreateSchema = object({
  name: projectName.required('Enter a project name.'),
  units: units.required('Choose the units.'),
  client: text(LIMITS.projectClientMaxLength, 'Client').default(''),
  location: text(LIMITS.projectLocationMaxLength, 'Location').default(''),
  status: status.default('draft'),
  notes: text(LIMITS.projectNotesMaxLength, 'Notes').default(''),
});
export type ProjectCreateInput = InferType<typeof projectCreateSchema>;

export const projectUpdateSchema = object({
  name: projectName.optional(),
  units: units.optional(),
  client: text(LIMITS.projectClientMaxLength, 'Client').optional(),
  location: text(LIMITS.projectLocationMaxLength, 'Location').optional(),
  status: status.optional(),
  notes: text(LIMITS.projectNotesMaxLength, 'Notes').optional(),
}).test('project-update-not-empty', 'Change at least one field.', (value) =>
  Object.values(value).some((field) => field !== undefined),
);
export type ProjectUpdateInput = InferType<typeof projectUpdateSchema>;

// Query strings: an empty parameter (`?sort=`) means "not given".
const blankToUndefined = (value: unknown, original: unknown) =>
  original === '' ? undefined : value;

export const projectListQuerySchema = object({
  search: string()
    .transform(trimString)
    .max(LIMITS.searchMaxLength, `Search has at most ${LIMITS.searchMaxLength} characters.`)
    // No stored text can hold a NUL (PostgreSQL refuses it), so say so rather than fail.
    .test(
      'search-no-nul',
      'Search cannot contain a NUL character.',
      (value) => !value?.includes('\u0000'),
    )
    .default(''),
  sort: string<ProjectSort>()
    .transform(blankToUndefined)
    .oneOf(PROJECT_SORTS, `Sort by one of: ${PROJECT_SORTS.join(', ')}.`)
    .default('updatedAt'),
  order: string<SortOrder>()
    .transform(blankToUndefined)
    .oneOf(SORT_ORDERS, 'Order is asc or desc.')
    .default('desc'),
  page: number()
    .transform(blankToUndefined)
    .typeError('Page must be a whole number.')
    .integer('Page must be a whole number.')
    .min(1, 'Page starts at 1.')
    .default(1),
  pageSize: number()
    .transform(blankToUndefined)
    .typeError('Page size must be a whole number.')
    .integer('Page size must be a whole number.')
    .min(1, 'Page size is at least 1.')
    .max(LIMITS.pageSizeMax, `Page size is at most ${LIMITS.pageSizeMax}.`)
    .default(LIMITS.pageSizeDefault),
});
export type ProjectListQuery = InferType<typeof projectListQuerySchema>;
