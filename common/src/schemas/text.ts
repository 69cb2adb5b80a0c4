// yup's own .trim() and .lowercase() call string methods on whatever arrives, so an object or an
// array in a text field throws a TypeError instead of failing validation. These transforms touch
// strings only and leave anything else to the schema's type check ("must be a string").

export const trimString = (value: unknown): unknown =>
  typeof value === 'string' ? value.trim() : value;

export const lowerString = (value: unknown): unknown =>
  typeof value === 'string' ? value.toLowerCase() : value;
