// The Basin choice step: one card per catalogue type with the outcome of each criterion; jet
// structures (flip and slotted buckets) are screened for whether the site points to them, so
// their criteria read as indications rather than limits met.
import { describe, expect, it } from 'vitest';
import { mount } from '@vue/test-utils';
import { DISSIPATOR_CATALOGUE, runStudy } from '@basinwright/common';
import DesignBasinChoiceStep from '../../web/src/components/DesignBasinChoiceStep.vue';
import { fenwickDesign } from '../../seed/designs';

// The SI demo study of product.md (invented scenario)
const result = runStudy(fenwickDesign);

describe('Basin choice', () => {
  const w = mount(DesignBasinChoiceStep, {
    props: { result, units: 'SI', chosenType: null, readOnly: false },
  });
  const statuses = (type: string) =>
    w.findAll(`[data-test="screening-${type}"] .crit-status`).map((x) => x.text());

  it('lists every catalogue type once, in rank order', () => {
    const shown = w
      .findAll('[data-test^="screening-"]')
      .map((x) => x.attributes('data-test')!.replace('screening-', ''));
    expect([...shown].sort()).toEqual(DISSIPATOR_CATALOGUE.map((m) => m.id).sort());
    expect(shown).toEqual(result.screening.map((s) => s.type));
  });

  it('a jump basin’s criteria read Meets / Caution / Fails; a jet structure’s read as indications', () => {
    const jets = result.screening.filter((s) => s.family === 'jet');
    expect(jets.length).toBeGreaterThan(0);
    for (const s of result.screening) {
      const words = statuses(s.type);
      expect(words).toHaveLength(s.criteria.length);
      const allowed =
        s.family === 'jet'
          ? ['Indicates', 'Borderline', 'Not indicated']
          : ['Meets', 'Caution', 'Fails'];
      for (const word of words) expect(allowed).toContain(word);
      // each word follows the engine's status for that criterion
      const expected = s.criteria.map((c) => allowed[['pass', 'warn', 'fail'].indexOf(c.status)]);
      expect(words).toEqual(expected);
    }
  });

  it('offers to size every type but the jet structures, which need a specialist study', () => {
    for (const s of result.screening) {
      const card = w.find(`[data-test="screening-${s.type}"]`);
      const offers = card.findAll('button').some((b) => b.text() === 'Size this type');
      const sized = card.text().includes('Sized on the next step');
      if (s.family === 'jet') expect(offers || sized).toBe(false);
      else expect(offers || sized).toBe(true);
    }
  });
});
