// Opening a saved design shows the result the server kept with it (web/src/composables/
// storedStudy.ts) when it answers the form's input exactly; the browser's engine then checks it
// quietly (useLiveResult's adopt). The check here: for both demo designs the result as the
// server keeps it (runStudy on the saved input, through JSON as the database gives it back) is,
// to the bit, what the browser's own engine path works out from the form — so showing it is
// showing the live answer — and any other input, or another engine version, is worked out anew.
import { describe, expect, it } from 'vitest';
import { defineComponent, h, nextTick } from 'vue';
import { mount } from '@vue/test-utils';
import { ENGINE_VERSION, runStudy, toSI, type StudyInput } from '@basinwright/common';
import { caldwellDesign, fenwickDesign } from '../../seed/designs';
import type { Design } from '../../web/src/api/designs';
import { designFormValues } from '../../web/src/composables/useDesign';
import { evaluateStudy } from '../../web/src/composables/studyInThread';
import { sameJson, storedResultFor } from '../../web/src/composables/storedStudy';
import { useLiveResult, type LiveOutcome } from '../../web/src/composables/useLive';

/** A design as GET /projects/:id/design answers it: input, and the result computed on save. */
function saved(input: StudyInput, engineVersion = ENGINE_VERSION): Design {
  const result = JSON.parse(JSON.stringify(runStudy(toSI(input)))) as Design['result'];
  return {
    projectId: 'p',
    input,
    options: {},
    updatedAt: '2026-12-01T00:00:00Z',
    revision: 3,
    updatedBy: null,
    result,
    engineVersion,
    computedAt: '2026-12-01T00:00:00Z',
  } as unknown as Design;
}

describe('storedResultFor', () => {
  for (const demo of [fenwickDesign, caldwellDesign]) {
    it(`the ${demo.units} demo: the kept result answers the form’s input and equals the browser’s own`, () => {
      const design = saved(demo);
      const form = designFormValues(demo, null, demo.units);
      const known = storedResultFor(form, design);
      expect(known).toBe(design.result);
      const live = evaluateStudy(form).result;
      expect(live).not.toBeNull();
      expect(sameJson(known, live)).toBe(true);
    });
  }

  it('a form holding more than the schema keeps (a stray key) is checked by the schema and still matches', () => {
    const design = saved(fenwickDesign);
    const form = designFormValues(fenwickDesign, null, 'SI');
    const stray = { ...form, strayKey: 1 };
    expect(sameJson(stray, design.input)).toBe(false); // not the shortcut: the schema's path
    expect(storedResultFor(stray, design)).toBe(design.result);
  });

  it('another input, another engine version, an unsaved design or an input the form refuses: none', () => {
    const design = saved(fenwickDesign);
    const form = designFormValues(fenwickDesign, null, 'SI');
    expect(storedResultFor({ ...form, designDischarge: form.designDischarge + 1 }, design)).toBe(
      null,
    );
    expect(storedResultFor(form, saved(fenwickDesign, '0.0.1'))).toBe(null);
    expect(storedResultFor(form, { ...design, input: null } as unknown as Design)).toBe(null);
    expect(storedResultFor({ ...form, designDischarge: -5 }, design)).toBe(null);
  });

  it('sameJson: key order and absent-or-undefined do not matter; a number differing in its last bit does', () => {
    expect(sameJson({ a: 1, b: [1, { c: 2 }] }, { b: [1, { c: 2 }], a: 1 })).toBe(true);
    expect(sameJson({ a: 1, b: undefined }, { a: 1 })).toBe(true);
    expect(sameJson({ a: 0.1 + 0.2 }, { a: 0.3 })).toBe(false);
    expect(sameJson([1, 2], { 0: 1, 1: 2 })).toBe(false);
    expect(sameJson({ a: null }, { a: 0 })).toBe(false);
  });
});

describe('useLiveResult: adopt', () => {
  function host(answers: Array<(v: LiveOutcome<{ n: number }> | null) => void>) {
    let live!: ReturnType<typeof useLiveResult<{ n: number }>>;
    mount(
      defineComponent({
        setup() {
          live = useLiveResult<{ n: number }>(
            () => new Promise((resolve) => answers.push(resolve)),
            10_000,
          );
          return () => h('div');
        },
      }),
    );
    return live;
  }
  const same = (a: { n: number }, b: { n: number }): boolean => a.n === b.n;

  it('shows the known value at once, nothing pending, and keeps it when the quiet check agrees', async () => {
    const answers: Array<(v: LiveOutcome<{ n: number }> | null) => void> = [];
    const live = host(answers);
    const known = { n: 1 };
    live.adopt(known, same);
    expect(live.value.value).toBe(known);
    expect([live.pending.value, live.computing.value, live.stale.value]).toEqual([
      false,
      false,
      false,
    ]);
    // The quiet check starts a task later (after the known value is drawn).
    expect(answers).toHaveLength(0);
    await new Promise((resolve) => setTimeout(resolve, 0));
    expect(answers).toHaveLength(1);
    answers[0]!({ value: { n: 1 }, engineError: null, inputProblems: [] });
    await nextTick();
    await Promise.resolve();
    expect(live.value.value).toBe(known);
  });

  it('replaces it when the quiet check answers differently', async () => {
    const answers: Array<(v: LiveOutcome<{ n: number }> | null) => void> = [];
    const live = host(answers);
    live.adopt({ n: 1 }, same);
    await new Promise((resolve) => setTimeout(resolve, 0));
    answers[0]!({ value: { n: 2 }, engineError: null, inputProblems: [] });
    await new Promise((resolve) => setTimeout(resolve, 0));
    expect(live.value.value).toEqual({ n: 2 });
  });

  it('a change before the check starts means no check at all', async () => {
    const answers: Array<(v: LiveOutcome<{ n: number }> | null) => void> = [];
    const live = host(answers);
    live.adopt({ n: 1 }, same);
    live.runNow();
    await new Promise((resolve) => setTimeout(resolve, 0));
    expect(answers).toHaveLength(1); // the change's own evaluation only
    answers[0]!({ value: { n: 4 }, engineError: null, inputProblems: [] });
    await new Promise((resolve) => setTimeout(resolve, 0));
    expect(live.value.value).toEqual({ n: 4 });
  });

  it('a change while the check runs drops the check’s answer', async () => {
    const answers: Array<(v: LiveOutcome<{ n: number }> | null) => void> = [];
    const live = host(answers);
    live.adopt({ n: 1 }, same);
    await new Promise((resolve) => setTimeout(resolve, 0)); // the check has started
    live.runNow();
    answers[0]!({ value: { n: 9 }, engineError: null, inputProblems: [] });
    answers[1]!({ value: { n: 3 }, engineError: null, inputProblems: [] });
    await new Promise((resolve) => setTimeout(resolve, 0));
    expect(live.value.value).toEqual({ n: 3 });
  });
});
