// papaparse 5 ships no types and @types/papaparse is not installed: the small part we call.
declare module 'papaparse' {
  export interface ParseError {
    type: string;
    code: string;
    message: string;
    row?: number;
  }
  export interface ParseConfig {
    delimiter?: string;
    skipEmptyLines?: boolean | 'greedy';
    comments?: string | false;
    header?: false;
  }
  export interface ParseResult {
    data: string[][];
    errors: ParseError[];
    meta: { delimiter: string; linebreak: string };
  }
  export function parse(input: string, config?: ParseConfig): ParseResult;
  const Papa: { parse: typeof parse };
  export default Papa;
}
