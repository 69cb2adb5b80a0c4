// Turns a proposal source into PDF bytes with pdfmake and the full Lato shipped in the
// lato-font package (its .woff files carry Δ, ≤, ³, √; the split @fontsource files do not).
// Nothing is fetched: URL access is refused and only the font files may be read.
import { createRequire } from 'node:module';
import path from 'node:path';
import { existsSync, mkdirSync, readFileSync, renameSync, statSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import { threadId } from 'node:worker_threads';
import { woffToSfnt } from './woff';
import { proposalDocument, type ProposalSource } from './proposal.document';
import { proposalUncertainty } from './proposal.uncertainty';

const require = createRequire(import.meta.url);

/** The slice of pdfmake 0.3's server API used here (the package ships no types). */
interface PdfMake {
  setFonts(fonts: Record<string, Record<string, string>>): void;
  setUrlAccessPolicy(callback: (url: string) => boolean): void;
  setLocalAccessPolicy(callback: (file: string) => boolean): void;
  createPdf(definition: object): { getBuffer(): Promise<Buffer> };
}
const pdfmake = require('pdfmake') as PdfMake;
const FONT_DIR = path.join(path.dirname(require.resolve('lato-font/package.json')), 'fonts');
const font = (name: string): string => path.join(FONT_DIR, name, `${name}.woff`);

/** The four faces of Lato pdfmake draws with. */
export const LATO_FILES = {
  normal: font('lato-normal'),
  bold: font('lato-bold'),
  italics: font('lato-normal-italic'),
  bolditalics: font('lato-bold-italic'),
};

let ready = false;
/**
 * Once per process: the faces decoded to TrueType into a folder of the system's temporary
 * directory (the SVG reader opens fonts by path), and pdfmake told to read those four files
 * and nothing else — no URL, no other file.
 */
function setUp(): void {
  if (ready) return;
  const dir = path.join(os.tmpdir(), `basinwright-lato-${process.getuid?.() ?? 'user'}`);
  mkdirSync(dir, { recursive: true });
  const faces: Record<string, string> = {};
  for (const [face, file] of Object.entries(LATO_FILES)) {
    const ttf = path.join(dir, `${path.basename(file, '.woff')}.ttf`);
    const bytes = woffToSfnt(readFileSync(file));
    if (!existsSync(ttf) || statSync(ttf).size !== bytes.length) {
      const part = `${ttf}.${process.pid}.${threadId}.part`;
      writeFileSync(part, bytes);
      renameSync(part, ttf);
    }
    faces[face] = ttf;
  }
  const allowed = new Set(Object.values(faces));
  pdfmake.setFonts({ Lato: faces });
  pdfmake.setUrlAccessPolicy(() => false);
  pdfmake.setLocalAccessPolicy((file) => allowed.has(path.resolve(file)));
  ready = true;
}

/** A proposal longer than the page cap: the renderer refuses it with this error. */
export class PageCapError extends Error {
  constructor(
    readonly pages: number,
    readonly cap: number,
  ) {
    super(
      `The proposal would run to ${pages} pages, more than the ${cap} a proposal may have. ` +
        'Check fewer discharges (the results table prints one line each) and generate it again.',
    );
    this.name = 'PageCapError';
  }
}

/**
 * More results-table lines than fit on a page (one a discharge): a version with more than
 * this × the page cap cannot fit, so its uncertainty is not run before the cap refuses it.
 */
const TABLE_LINES_PER_PAGE = 80;

/** The source with the uncertainty of the floor run now when it does not carry one. */
export function withUncertainty(source: ProposalSource, maxPages = Infinity): ProposalSource {
  if (source.uncertainty !== undefined) return source;
  if (source.version.result.rows.length > maxPages * TABLE_LINES_PER_PAGE)
    return { ...source, uncertainty: null };
  return {
    ...source,
    uncertainty: proposalUncertainty(
      source.version.input,
      source.version.result,
      source.project.units,
    ),
  };
}

/** Renders the proposal (the uncertainty run first, when needed); throws PageCapError past `maxPages`. */
export async function renderProposal(
  source: ProposalSource,
  maxPages: number,
): Promise<{ pdf: Buffer; pages: number }> {
  setUp();
  const { definition, pageCount } = proposalDocument(withUncertainty(source, maxPages));
  const pdf = await pdfmake.createPdf(definition).getBuffer();
  if (pageCount.value > maxPages) throw new PageCapError(pageCount.value, maxPages);
  return { pdf, pages: pageCount.value };
}
