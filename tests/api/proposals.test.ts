// The proposal PDF end to end through the API: queued, drawn by the background job in its
// worker thread, downloaded, read back as text with poppler's pdftotext, its fonts listed with
// pdffonts, its first page turned into a PNG with pdftoppm (kept in test-results/proposals/),
// e-mailed with the PDF attached; the page cap; other firms; /health while five render.
//
// What the PDF must print is taken from the issued version itself (its stored result, SI,
// formatted in the project's units); the hydraulics behind those numbers are checked against
// published relations in tests/common. Waits are for conditions (a status, a message), never
// for a time.
import { execFileSync } from 'node:child_process';
import { mkdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import {
  ENGINE_VERSION,
  figuresOf,
  runStudy,
  toSI,
  unitFormat,
  type StudyInput,
  type StudyResult,
} from '@basinwright/common';
import { fenwickDesign } from '../../seed/designs';
import { expectRel } from '../support/tolerance';
import {
  addMember,
  apiForFile,
  bearer,
  setPlan,
  signUpFirm,
  uniqueEmail,
  type SignedUp,
} from '../support/api-app';

// A page cap low enough that a long results table passes it (the demo proposal is ~10 pages).
process.env.PROPOSAL_MAX_PAGES = '14';

const ARTIFACTS = path.resolve('test-results/proposals');
/** A render on a busy 2-core machine: the deadline only tells a hang from an answer. */
const RENDER_DEADLINE_MS = 240_000;

let concept: SignedUp;
let paid: SignedUp;
let other: SignedUp;
let engineerToken = '';
const demoResult: StudyResult = runStudy(toSI(fenwickDesign));

const h = apiForFile(async () => {
  concept = await signUpFirm(h, 'proposal-concept');
  paid = await signUpFirm(h, 'proposal-paid');
  other = await signUpFirm(h, 'proposal-other');
  await setPlan(h, paid.firm.id, 'firm', 5);
  engineerToken = (await addMember(h, concept.firm.id, 'engineer')).token;
});

/** A project with the demo design and an issued version of it (versions are made by their own module). */
async function issuedDemo(
  firm: SignedUp,
  input: StudyInput = fenwickDesign,
  result: StudyResult = demoResult,
  count = 1,
): Promise<{ projectId: string; versionIds: string[] }> {
  const { Project, Design, DesignVersion } = h.models;
  // the version keeps the time its result was computed, as issuing one does (an estimate priced
  // from the draft's result is matched to the version on it)
  const computedAt = new Date();
  const project = await Project.create({
    firmId: firm.firm.id,
    name: 'Fenwick Mill Pond — auxiliary spillway outlet',
    client: 'Fenwick Mill Pond Trust',
    location: 'Harrowdale',
    units: 'SI',
    createdById: firm.user.id,
  });
  const design = await Design.create({
    firmId: firm.firm.id,
    projectId: project.id,
    input,
    options: null,
    updatedById: firm.user.id,
    result,
    engineVersion: ENGINE_VERSION,
    computedAt,
  });
  const versionIds: string[] = [];
  for (let number = 1; number <= count; number++) {
    const v = await DesignVersion.create({
      firmId: firm.firm.id,
      projectId: project.id,
      designId: design.id,
      number,
      designRevision: 1,
      input,
      options: null,
      result,
      engineVersion: ENGINE_VERSION,
      computedAt,
      figures: figuresOf(result),
      note: '',
      issuedById: firm.user.id,
      issuedByName: firm.user.name,
    });
    versionIds.push(v.id);
  }
  return { projectId: project.id, versionIds };
}

interface ProposalBody {
  id: string;
  status: string;
  error: string | null;
  pages: number | null;
  download: string | null;
  sent: { to: string; by: string; at: string }[];
}

/** Polls the proposal until it is done or failed. */
async function settled(token: string, projectId: string, id: string): Promise<ProposalBody> {
  const deadline = Date.now() + RENDER_DEADLINE_MS;
  for (;;) {
    const res = await h
      .http()
      .get(`/api/v1/projects/${projectId}/proposals/${id}`)
      .set(bearer(token));
    expect(res.status).toBe(200);
    const body = res.body as ProposalBody;
    if (body.status === 'done' || body.status === 'failed') return body;
    if (Date.now() > deadline) throw new Error(`proposal ${id} still ${body.status}`);
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
}

async function generate(token: string, projectId: string, versionId: string) {
  const res = await h
    .http()
    .post(`/api/v1/projects/${projectId}/proposals`)
    .set(bearer(token))
    .send({ versionId });
  expect(res.status, JSON.stringify(res.body)).toBe(202);
  expect(res.body.status).toBe('queued');
  return res.body as ProposalBody;
}

async function download(token: string, projectId: string, p: ProposalBody, name: string) {
  const res = await h
    .http()
    .get(`/api/v1${p.download}`)
    .set(bearer(token))
    .buffer(true)
    .parse((response, done) => {
      const chunks: Buffer[] = [];
      response.on('data', (c: Buffer) => chunks.push(c));
      response.on('end', () => done(null, Buffer.concat(chunks)));
    });
  expect(res.status).toBe(200);
  expect(res.headers['content-type']).toMatch(/^application\/pdf/);
  expect(res.headers['content-disposition']).toMatch(/proposal-v\d+\.pdf/);
  const pdf = res.body as Buffer;
  expect(pdf.subarray(0, 5).toString('latin1')).toBe('%PDF-');
  mkdirSync(ARTIFACTS, { recursive: true });
  const file = path.join(ARTIFACTS, `${name}.pdf`);
  writeFileSync(file, pdf);
  void projectId;
  return file;
}

const pdftotext = (file: string) => execFileSync('pdftotext', ['-layout', file, '-']).toString();

describe('the proposal of the demo design', () => {
  it(
    'on a Concept firm: watermark, figures, cautions, "not reviewed"; Lato embedded; a page as PNG',
    async () => {
      const { projectId, versionIds } = await issuedDemo(concept);
      const queued = await generate(engineerToken, projectId, versionIds[0]!);
      const done = await settled(engineerToken, projectId, queued.id);
      expect(done.status, done.error ?? '').toBe('done');
      expect(done.pages).toBeGreaterThanOrEqual(8);
      const file = await download(engineerToken, projectId, done, 'concept');
      const text = pdftotext(file);
      const f = unitFormat('SI');
      const figures = figuresOf(demoResult);
      // The watermark of the free plan (product.md), drawn on every page.
      expect(text).toContain('Concept plan');
      // The design discharge as the demo states it (product.md: 85 m³/s).
      expect(text).toContain('85.00 m³/s');
      expect(text).toContain('USBR Type II basin');
      expect(text).toContain(f.withUnit(figures.floorElevation, 'length'));
      // Cautions (product.md) and the review block printed plainly.
      expect(text).toContain('licensed professional engineer');
      expect(text).toContain('physical or numerical model studies');
      expect(text).toContain('NOT REVIEWED');
      expect(text).toContain('Quantities and cost: not priced yet');
      // How sure the floor is (its figures are checked in proposal-document.test.ts), with the
      // tornado chart drawn as vector text and lines; its page kept as an image.
      expect(text).toContain('How sure the floor is');
      expect(text).toContain('Which input moves the floor most');
      expect(text).toMatch(/2,000\s+samples\s+were\s+drawn/);
      // The symbols the proposal prints come out as text, not empty boxes.
      for (const symbol of ['Δ', '≤', '³', '√']) expect(text).toContain(symbol);
      // Every font in the file is Lato, embedded.
      const fonts = execFileSync('pdffonts', [file]).toString().trim().split('\n').slice(2);
      expect(fonts.length).toBeGreaterThan(0);
      for (const line of fonts) {
        expect(line).toMatch(/\+Lato-/);
        expect(line).toMatch(/ yes +yes +yes /);
      }
      // The first page as an image, kept as a test artifact.
      execFileSync('pdftoppm', [
        '-png',
        '-r',
        '60',
        '-f',
        '1',
        '-l',
        '1',
        file,
        path.join(ARTIFACTS, 'concept-page'),
      ]);
      const png = execFileSync('ls', [ARTIFACTS]).toString();
      expect(png).toMatch(/concept-page-0?1\.png/);
      const pages = text.split('\f');
      const at = pages.findIndex((p) => p.includes('How sure the floor is')) + 1;
      expect(at).toBeGreaterThan(1);
      execFileSync('pdftoppm', [
        '-png',
        '-r',
        '70',
        '-f',
        String(at),
        '-l',
        String(at),
        file,
        path.join(ARTIFACTS, 'concept-uncertainty'),
      ]);
      expect(execFileSync('ls', [ARTIFACTS]).toString()).toMatch(/concept-uncertainty-\d+\.png/);
    },
    RENDER_DEADLINE_MS + 30_000,
  );

  it(
    'on a paid firm: the firm on the cover, no watermark, the approval with the reviewer',
    async () => {
      const { projectId, versionIds } = await issuedDemo(paid);
      // Approve by the review columns (the only ones the version's trigger lets change).
      await h.models.DesignVersion.update(
        {
          reviewState: 'approved',
          reviewedByName: 'Morwenna Harrow',
          reviewedAt: new Date(),
          reviewerLicence: 'PE-4471',
          reviewerJurisdiction: 'Harrowdale',
          reviewerStatement: 'Reviewed as a concept design only.',
        },
        { where: { id: versionIds[0]! } },
      );
      const queued = await generate(paid.token, projectId, versionIds[0]!);
      const done = await settled(paid.token, projectId, queued.id);
      expect(done.status, done.error ?? '').toBe('done');
      const text = pdftotext(await download(paid.token, projectId, done, 'paid'));
      expect(text).not.toContain('Concept plan');
      expect(text).toContain(paid.firm.name);
      expect(text).toContain('85.00 m³/s');
      expect(text).toContain('Morwenna Harrow');
      expect(text).toContain('PE-4471');
      expect(text).toContain('Reviewed as a concept design only.');
      expect(text).not.toContain('NOT REVIEWED');

      // E-mailed to the client: the PDF attached, the firm as the sender's name, recorded.
      const to = uniqueEmail('client');
      const sent = await h
        .http()
        .post(`/api/v1/projects/${projectId}/proposals/${done.id}/send`)
        .set(bearer(paid.token))
        .send({ to });
      expect(sent.status, JSON.stringify(sent.body)).toBe(200);
      expect(sent.body.sent).toEqual([expect.objectContaining({ to, by: paid.user.name })]);
      const mail = await h.waitForMail(to);
      expect(mail.raw).toMatch(/Content-Type: application\/pdf/i);
      expect(mail.raw).toMatch(
        /filename="?fenwick-mill-pond-auxiliary-spillway-outlet-proposal-v1\.pdf/,
      );
      expect(mail.raw).toMatch(new RegExp(`^From: .*${paid.firm.name.split(' ')[0]}`, 'm'));
      const emails = await h.models.ProposalEmail.findAll({ where: { versionId: versionIds[0]! } });
      expect(emails.map((e) => e.recipient)).toEqual([to]);

      // The project's audit trail (its panel reads this route) keeps the drawing and the
      // sending: who, when, to whom, which version.
      const trail = await h
        .http()
        .get(`/api/v1/projects/${projectId}/audit`)
        .set(bearer(paid.token));
      expect(trail.status).toBe(200);
      const steps = trail.body.items as {
        action: string;
        versionId: string | null;
        actor: { id: string | null; name: string };
        summary: string;
        detail: Record<string, unknown> | null;
        at: string;
      }[];
      const drawn = steps.filter((e) => e.action === 'proposal.rendered');
      const mailed = steps.filter((e) => e.action === 'proposal.sent');
      expect(drawn).toHaveLength(1);
      expect(mailed).toHaveLength(1);
      expect(drawn[0]).toMatchObject({
        versionId: versionIds[0],
        actor: { id: paid.user.id, name: paid.user.name },
        detail: { number: 1, proposalId: done.id, pages: done.pages },
      });
      expect(drawn[0]!.summary).toContain('version 1');
      expect(mailed[0]).toMatchObject({
        versionId: versionIds[0],
        actor: { id: paid.user.id, name: paid.user.name },
        detail: { number: 1, proposalId: done.id, to },
      });
      expect(mailed[0]!.summary).toBe(
        `${paid.user.name} e-mailed the proposal of version 1 to ${to}`,
      );
      // oldest first: drawn, then sent, and the send recorded at the time it was recorded on the e-mail
      expect(steps.indexOf(drawn[0]!)).toBeLessThan(steps.indexOf(mailed[0]!));
      expect(Math.abs(Date.parse(mailed[0]!.at) - emails[0]!.sentAt.getTime())).toBeLessThan(
        60_000,
      );
    },
    RENDER_DEADLINE_MS + 30_000,
  );
});

/** 1 yd³ = 0.9144³ m³ exactly (the international yard, 1959): a fact of the trade. */
const M3_PER_YD3 = 0.9144 ** 3;

/** The amounts in the stated order (ESTIMATE_STEPS), written out by hand for these settings. */
function handTotal(direct: number): number {
  const located = direct * 1.1;
  const siteCosts = located + 0.05 * located + 0.03 * located;
  const withContingency = siteCosts * 1.2;
  const withOverhead = withContingency * 1.15;
  return withOverhead * 1.04 ** 2; // two years at 4 %, compounded
}

/** Whole currency units with thousands grouped, as a money amount is written in English. */
const money = (v: number) => Math.round(v).toLocaleString('en-US');

describe('the proposal of a priced version', () => {
  it(
    'prints the take-off by element and the issued estimate: total, AACE range, currency, price book',
    async () => {
      const { projectId, versionIds } = await issuedDemo(paid);
      const auth = bearer(paid.token);
      const book = await h
        .http()
        .post('/api/v1/price-books')
        .set(auth)
        .send({ name: 'Harrowdale rates 2026', currency: 'USD' });
      expect(book.status, JSON.stringify(book.body)).toBe(201);
      const items = await h
        .http()
        .put(`/api/v1/price-books/${book.body.id}/items`)
        .set(auth)
        .send({
          items: [
            { code: 'CON', description: 'Slab concrete', unit: 'm³', unitPrice: 400 },
            { code: 'EXC', description: 'Excavation', unit: 'CY', unitPrice: 15 },
          ],
        });
      expect(items.status).toBe(200);
      const takeoff = await h.http().get(`/api/v1/projects/${projectId}/takeoff`).set(auth);
      const q = (key: string) =>
        (takeoff.body.lines as { key: string; quantity: number }[]).find((l) => l.key === key)!
          .quantity;
      const made = await h
        .http()
        .post(`/api/v1/projects/${projectId}/estimates`)
        .set(auth)
        .send({ priceBookId: book.body.id });
      expect(made.status).toBe(201);
      const patched = await h
        .http()
        .patch(`/api/v1/estimates/${made.body.id}`)
        .set(auth)
        .send({
          settings: {
            locationFactor: 1.1,
            percentages: {
              mobilisation: 0.05,
              careOfWater: 0.03,
              contingency: 0.2,
              overheadAndProfit: 0.15,
            },
            escalation: { annualRate: 0.04, years: 2 },
            accuracy: { aaceClass: 4 },
          },
          mapping: { 'concrete.floorSlab': 'CON', 'excavation.structure': 'EXC' },
        });
      expect(patched.status, JSON.stringify(patched.body).slice(0, 300)).toBe(200);
      const issued = await h.http().post(`/api/v1/estimates/${made.body.id}/issue`).set(auth);
      expect(issued.status).toBe(200);
      const direct = q('concrete.floorSlab') * 400 + (q('excavation.structure') / M3_PER_YD3) * 15;
      const total = handTotal(direct);
      expectRel(issued.body.totals.total, total, 1e-12);

      const queued = await generate(paid.token, projectId, versionIds[0]!);
      const done = await settled(paid.token, projectId, queued.id);
      expect(done.status, done.error ?? '').toBe('done');
      const file = await download(paid.token, projectId, done, 'priced');
      const text = pdftotext(file);
      expect(text).not.toContain('not priced yet');
      // The take-off by element, in the project's units (SI here).
      expect(text).toContain('Quantities by element');
      // the slab's concrete is over 100 m³, so it is printed in whole m³
      expect(q('concrete.floorSlab')).toBeGreaterThan(100);
      expect(text).toMatch(
        new RegExp(`Concrete — Floor slab\\s+${money(q('concrete.floorSlab'))}\\s+m³`),
      );
      expect(text).toContain('Excavation — Whole structure');
      // The total and the AACE 18R-97 class 4 range at its wide ends (−30 %, +50 %).
      expect(text).toMatch(new RegExp(`Total\\s+USD ${money(total)}`));
      expect(text).toContain('AACE Class 4 (-30 % to +50 %)');
      expect(text).toContain(`USD ${money(total * 0.7)} to ${money(total * 1.5)}`);
      expect(text).toContain('Escalation (4 % a year for 2 years, compounded)');
      expect(text).toContain('price book "Harrowdale rates 2026" (USD)');
      // Every page as an image, kept as test artifacts (the quantities and cost page to look at).
      execFileSync('pdftoppm', ['-png', '-r', '70', file, path.join(ARTIFACTS, 'priced-page')]);
      expect(execFileSync('ls', [ARTIFACTS]).toString()).toMatch(/priced-page-0?1\.png/);
    },
    RENDER_DEADLINE_MS + 30_000,
  );
});

describe('refusals', () => {
  it(
    'a proposal past the page cap fails with a message saying so; its PDF cannot be downloaded',
    async () => {
      // 400 discharges: one table line each, far past the cap of 14 pages set above.
      const long: StudyInput = {
        ...fenwickDesign,
        discharges: { kind: 'range', min: 5, max: 85, count: 400 },
      };
      const { projectId, versionIds } = await issuedDemo(concept, long, runStudy(toSI(long)));
      const queued = await generate(concept.token, projectId, versionIds[0]!);
      const failed = await settled(concept.token, projectId, queued.id);
      expect(failed.status).toBe('failed');
      expect(failed.error).toMatch(/more than the 14 a proposal may have/);
      const res = await h
        .http()
        .get(`/api/v1/projects/${projectId}/proposals/${queued.id}/pdf`)
        .set(bearer(concept.token));
      expect(res.status).toBe(409);
      expect(res.body.code).toBe('conflict');
    },
    RENDER_DEADLINE_MS + 30_000,
  );

  it('another firm gets 404 on every proposal route, and a version of another project is 404', async () => {
    const { projectId, versionIds } = await issuedDemo(concept);
    const mine = await h.models.Proposal.create({
      firmId: concept.firm.id,
      projectId,
      versionId: versionIds[0]!,
      requestedById: concept.user.id,
      status: 'failed',
      error: 'probe',
    });
    const base = `/api/v1/projects/${projectId}/proposals`;
    const probes = [
      h.http().get(base).set(bearer(other.token)),
      h.http().post(base).set(bearer(other.token)).send({ versionId: versionIds[0] }),
      h.http().get(`${base}/${mine.id}`).set(bearer(other.token)),
      h.http().get(`${base}/${mine.id}/pdf`).set(bearer(other.token)),
      h
        .http()
        .post(`${base}/${mine.id}/send`)
        .set(bearer(other.token))
        .send({ to: 'x@test.example' }),
    ];
    for (const res of await Promise.all(probes)) {
      expect(res.status).toBe(404);
      expect(res.body.code).toBe('not_found');
    }
    // Their own project with our version's id: not found, nothing queued.
    const theirs = await issuedDemo(other);
    const res = await h
      .http()
      .post(`/api/v1/projects/${theirs.projectId}/proposals`)
      .set(bearer(other.token))
      .send({ versionId: versionIds[0] });
    expect(res.status).toBe(404);
    expect(await h.models.Proposal.count({ where: { projectId: theirs.projectId } })).toBe(0);
  });

  it('bad input is a 422 naming the field; sending an unfinished proposal is a 409', async () => {
    const { projectId, versionIds } = await issuedDemo(concept);
    const base = `/api/v1/projects/${projectId}/proposals`;
    const bad = await h.http().post(base).set(bearer(concept.token)).send({ versionId: 'nope' });
    expect(bad.status).toBe(422);
    expect(bad.body.details).toHaveProperty('versionId');
    const queued = await h.models.Proposal.create({
      firmId: concept.firm.id,
      projectId,
      versionId: versionIds[0]!,
      requestedById: concept.user.id,
    });
    const badTo = await h
      .http()
      .post(`${base}/${queued.id}/send`)
      .set(bearer(concept.token))
      .send({ to: 'not an address' });
    expect(badTo.status).toBe(422);
    expect(badTo.body.details).toHaveProperty('to');
    const early = await h
      .http()
      .post(`${base}/${queued.id}/send`)
      .set(bearer(concept.token))
      .send({ to: 'client@test.example' });
    expect(early.status).toBe(409);
    expect(await h.models.ProposalEmail.count({ where: { proposalId: queued.id } })).toBe(0);
  });
});

describe('the API keeps answering while proposals render', () => {
  it(
    '/api/v1/health answers 200 while five proposals are queued and drawn',
    async () => {
      const { projectId, versionIds } = await issuedDemo(paid, fenwickDesign, demoResult, 5);
      const queued = await Promise.all(versionIds.map((id) => generate(paid.token, projectId, id)));
      // Condition: one of them is being drawn right now (the worker thread is busy).
      const ids = queued.map((q) => q.id);
      const deadline = Date.now() + RENDER_DEADLINE_MS;
      let checks = 0;
      for (;;) {
        const rows = await h.models.Proposal.findAll({ where: { id: ids } });
        if (rows.every((r) => r.status === 'done' || r.status === 'failed')) break;
        if (rows.some((r) => r.status === 'rendering')) {
          const health = await h.http().get('/api/v1/health');
          expect(health.status).toBe(200);
          checks += 1;
        }
        if (Date.now() > deadline) throw new Error('five proposals not drawn');
        await new Promise((resolve) => setTimeout(resolve, 50));
      }
      expect(checks).toBeGreaterThan(0);
      const list = await h
        .http()
        .get(`/api/v1/projects/${projectId}/proposals`)
        .set(bearer(paid.token));
      expect(list.status).toBe(200);
      const ours = (list.body.items as ProposalBody[]).filter((p) => ids.includes(p.id));
      expect(ours.map((p) => p.status)).toEqual(['done', 'done', 'done', 'done', 'done']);
    },
    5 * RENDER_DEADLINE_MS,
  );
});
