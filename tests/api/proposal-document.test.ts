// The proposal's document definition (pure: no database, no PDF) for the demo design: the
// uncertainty of the floor it prints — the probability of sweep-out at the chosen basin's floor
// with its sampling error, the sample count and seed, the floor for 90 % — equals common's
// runUncertainty for the same seed and spreads, and the tornado chart is drawn as SVG. The
// relations behind runUncertainty are checked in tests/common/uncertainty.test.ts.
import { describe, expect, it } from 'vitest';
import {
  defaultUncertainInputs,
  runStudy,
  runUncertainty,
  toSI,
  UNCERTAIN_INPUT_NAMES,
  unitFormat,
  type StudyInput,
  type UnitSystem,
} from '@basinwright/common';
import {
  proposalDocument,
  type ProposalSource,
} from '../../api/src/modules/proposals/proposal.document';
import { drawingToSvg } from '@basinwright/common';
import { withUncertainty } from '../../api/src/modules/proposals/proposal.render';
import { PROPOSAL_UNCERTAINTY } from '../../api/src/modules/proposals/proposal.uncertainty';
import { fenwickDesign } from '../../seed/designs';
import { expectRel } from '../support/tolerance';

const demoResult = runStudy(toSI(fenwickDesign));

function demoSource(units: UnitSystem): ProposalSource {
  const at = new Date('2026-12-03T04:00:00Z');
  return {
    firm: { name: 'Harrow & Lune Engineering', plan: 'concept', brand: null, sealStatement: null },
    project: {
      name: 'Fenwick Mill Pond — auxiliary spillway outlet',
      client: 'Fenwick Mill Pond Trust',
      location: 'Harrowdale',
      units,
    },
    version: {
      number: 1,
      input: fenwickDesign,
      result: demoResult,
      engineVersion: 'test',
      computedAt: at,
      issuedByName: 'Demo engineer',
      issuedAt: at,
      note: '',
    },
    review: {
      state: 'not_sent',
      reviewedByName: null,
      reviewedAt: null,
      licence: null,
      jurisdiction: null,
      statement: null,
    },
    cost: null,
    generatedAt: at,
  };
}

/** Every string the definition prints, in order (text, tables, lists, columns, stacks). */
function textsOf(node: unknown, out: string[] = []): string[] {
  if (typeof node === 'string') out.push(node);
  else if (Array.isArray(node)) for (const n of node) textsOf(n, out);
  else if (node && typeof node === 'object') {
    const o = node as Record<string, unknown>;
    for (const key of ['text', 'stack', 'columns', 'ul', 'ol']) if (key in o) textsOf(o[key], out);
    if (o.table && typeof o.table === 'object') textsOf((o.table as { body: unknown }).body, out);
  }
  return out;
}

function svgsOf(content: unknown[]): string[] {
  return content
    .filter((n): n is { svg: string } => typeof n === 'object' && n !== null && 'svg' in n)
    .map((n) => n.svg);
}

/** The demo's basin (a jump basin) and the request the proposal must make for it. */
function expectedRun() {
  const design = demoResult.design?.design;
  if (design?.family !== 'jump-basin') throw new Error('the demo chooses a jump basin');
  const input: StudyInput = {
    ...toSI(fenwickDesign),
    floorElevation: design.floorElevation,
    tailwaterFactor: design.sizing.tailwaterFactor,
  };
  return {
    design,
    input,
    request: { inputs: defaultUncertainInputs(input), ...PROPOSAL_UNCERTAINTY },
  };
}

describe('the uncertainty of the floor in the proposal', () => {
  for (const units of ['SI', 'US'] as const) {
    it(`prints what runUncertainty gives for the same seed, in ${units}`, () => {
      const source = withUncertainty(demoSource(units));
      const u = source.uncertainty;
      if (u == null || 'refused' in u) throw new Error('the demo design is analysed');
      const { design, input, request } = expectedRun();
      // The request is the one asked for: default spreads, 2,000 samples, the fixed seed, 90 %.
      expect(u.request).toEqual(request);
      expect(u.floor).toEqual({
        basin: design.name,
        tailwaterFactor: design.sizing.tailwaterFactor,
      });
      // The same seed gives the same numbers (seedrandom): the run made here independently.
      const own = runUncertainty(input, request);
      expect(u.result).toEqual(own);
      const mc = own.monteCarlo;
      // The risk is computed at the floor the proposal prints for the basin.
      expect(own.chosenFloor).toBe(design.floorElevation);
      // Sampling error of a proportion: √(p(1 − p)/N) (any text on the binomial distribution).
      expectRel(mc.standardError, Math.sqrt((mc.probability * (1 - mc.probability)) / 2000), 1e-12);
      expect(mc.floorAtConfidence).not.toBeNull();

      const { definition } = proposalDocument(source);
      const content = definition.content as unknown[];
      const text = textsOf(content).join(' ');
      const f = unitFormat(units);
      const pct = (p: number) => `${(p * 100).toFixed(1)} %`;
      expect(text).toContain('How sure the floor is');
      expect(text).toContain('2,000 samples were drawn (seed “basinwright”');
      expect(text).toContain(
        `on the floor of the ${design.name} (${f.withUnit(design.floorElevation, 'length')}), so that the jump is swept out: ${pct(mc.probability)}, with a sampling error (standard error) of ${pct(mc.standardError)}.`,
      );
      expect(text).toContain(
        `The floor that holds the jump in 90 % of the samples: ${f.withUnit(mc.floorAtConfidence!.elevation, 'length')}`,
      );
      if (mc.mostOftenQ)
        expect(text).toContain(`most often at ${f.withUnit(mc.mostOftenQ.Q, 'discharge')}`);
      // Every spread with its basis.
      for (const x of request.inputs) {
        expect(text).toContain(UNCERTAIN_INPUT_NAMES[x.key]);
        expect(text).toContain(x.basis);
      }

      // The tornado chart, vector graphics: one labelled row per input, each bar's change printed.
      const tornado = svgsOf(content).find((s) => s.includes('Which input moves the floor most'));
      expect(tornado).toBeDefined();
      expect(tornado).toMatch(/^<svg xmlns="http:\/\/www\.w3\.org\/2000\/svg"/);
      for (const row of own.sensitivity) {
        expect(tornado).toContain(`>${UNCERTAIN_INPUT_NAMES[row.key]}<`);
        for (const change of [row.changeAtLow, row.changeAtHigh])
          if (change !== null) expect(tornado).toContain(`>${f.num(change, 'length')}<`);
      }
      expect(tornado).toContain(`Change in the required floor elevation (${f.label('length')})`);
      // Sensitivity sign as the trade knows it: a rougher downstream channel (larger n) stands
      // the tailwater higher (Manning's equation), so the required floor rises.
      const n = own.sensitivity.find((r) => r.key === 'downstreamN');
      expect(n?.changeAtHigh).toBeGreaterThan(0);
    });
  }

  it('a version whose results table alone passes the page cap is not analysed (the cap refuses it)', () => {
    // 17 discharges, one table line each, against a cap of no page at all
    const source = withUncertainty(demoSource('SI'), 0);
    expect(source.uncertainty).toBeNull();
    const text = textsOf(proposalDocument(source).definition.content).join(' ');
    expect(text).not.toContain('How sure the floor is');
    expect(text).toContain('Results over the discharge range');
  });

  it('a stored run is printed as it is, not run again', () => {
    const first = withUncertainty(demoSource('SI'));
    expect(withUncertainty(first)).toBe(first);
  });
});

// pdfmake's SVG renderer ignores paint-order: a label's white halo must come as its own element
// under the text, or the label is painted white on the white sheet (seen in the demo proposal).
// The proposal asks drawingToSvg for halos as underlays; the PDF made from the demo holds them.
describe('the drawing in the PDF: label halos under their text', () => {
  it('every label is an outline without fill, then the same text without stroke', () => {
    const drawing = runStudy(fenwickDesign).design!.drawing;
    const browser = drawingToSvg(drawing, { width: 960, fontFamily: 'Lato' });
    const haloed = (browser.match(/paint-order="stroke"/g) ?? []).length;
    expect(haloed).toBeGreaterThan(5);
    const out = drawingToSvg(drawing, { width: 960, fontFamily: 'Lato', halo: 'underlay' });
    expect(out).not.toContain('paint-order');
    const texts = [...out.matchAll(/<text ([^>]*)>([^<]*)<\/text>/g)];
    const outlines = texts.filter((t) => t[1]!.includes('fill="none"'));
    expect(outlines).toHaveLength(haloed);
    for (const o of outlines) {
      const next = texts[texts.indexOf(o) + 1]!;
      expect(next[2]).toBe(o[2]); // the same words on top
      expect(next[1]).toContain('fill="#0f172a"');
      expect(next[1]).not.toContain('stroke=');
    }
  });

  it('the proposal’s drawing page carries the labels that way', () => {
    const { definition } = proposalDocument(withUncertainty(demoSource('SI'), 0));
    const svgs = JSON.stringify(definition.content).match(/<svg[^]*?<\/svg>/g) ?? [];
    const drawing = svgs.find((x) => x.includes('data-role=\\"label-'));
    expect(drawing).toBeDefined();
    expect(drawing).not.toContain('paint-order');
    expect(drawing).toContain('fill=\\"none\\" stroke=\\"#ffffff\\"');
  });
});
