// The shared renderer's SVG is well-formed XML for every type the demo study designs, in either
// unit system: the web inlines it (an HTML parser forgives a repeated attribute) but a file or
// the proposal PDF reads it as XML, which does not [fact of the format: XML 1.0 §3.1, an
// attribute name appears at most once in a tag].
import { describe, expect, it } from 'vitest';
import { drawingToSvg, runStudy, toSI } from '@basinwright/common';
import { caldwellDesign, fenwickDesign } from '../../seed/designs';

const parser = new DOMParser();

describe.each([
  ['SI demo', runStudy(fenwickDesign)],
  ['US demo', runStudy(toSI(caldwellDesign))],
])('%s: every designed type draws as well-formed XML', (_name, result) => {
  const entries = [result.design!, ...result.alternatives];
  it.each(entries.map((e) => [e.type, e] as const))('%s', (_type, entry) => {
    const svg = drawingToSvg(entry.drawing, {
      width: 900,
      scaleUnit: { label: 'ft', metres: 0.3048 },
    });
    const doc = parser.parseFromString(svg, 'image/svg+xml');
    expect(doc.getElementsByTagName('parsererror')).toHaveLength(0);
    expect(doc.documentElement.tagName).toBe('svg');
    // the view titles keep their own colour, written once
    const titles = [...doc.querySelectorAll('text[font-weight="bold"]')];
    expect(titles.length).toBeGreaterThan(1);
  });
});
