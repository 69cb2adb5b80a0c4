// POST /calc/cheapest: the width × type search in the compute pool. The answer is checked
// against the engine's own search run here (the same function, SI), and against the request in
// US units: the same widths converted give the same costs. Bad input is a 422 naming the field.
import { describe, expect, it } from 'vitest';
import { cheapestDesign, toSI, type StudyInput } from '@basinwright/common';
import { bearer, signUpFirm, apiForFile } from '../support/api-app';
import { expectRel } from '../support/tolerance';
import { caldwellDesign, fenwickDesign } from '../../seed/designs';

let token: string;
const h = apiForFile(async () => {
  token = (await signUpFirm(h, 'cheapest')).token;
});

// Invented unit rates per SI unit (test data only).
const rates = { byKind: { concrete: 300, reinforcement: 2, excavation: 15, riprap: 60 } };
const demo = {
  ...fenwickDesign,
  discharges: { kind: 'range', min: 5, max: 85, count: 9 },
} as StudyInput;

const post = (body: unknown, t: string | null = token) => {
  const req = h.http().post('/api/v1/calc/cheapest');
  return (t === null ? req : req.set(bearer(t))).send(body as object);
};

describe('POST /api/v1/calc/cheapest', () => {
  it('answers the search with the chart data and the cheapest passing design', async () => {
    const res = await post({ input: demo, width: { min: 10, max: 20, steps: 3 }, rates });
    expect(res.status).toBe(200);
    const local = cheapestDesign({ study: demo, width: { min: 10, max: 20, steps: 3 }, rates });
    expect(res.body.widths).toEqual(local.widths);
    expect(res.body.best.type).toBe(local.best!.type);
    expectRel(res.body.best.cost, local.best!.cost, 1e-12);
    expect(res.body.series.length).toBe(local.series.length);
    expect(res.body.best.takeoff.lines.length).toBeGreaterThan(0);
    expect(res.body.unpricedKeys).toContain('formwork.sideWalls');
  });
  it('takes widths in the units of a US input (ft → m, 1 ft = 0.3048 m)', async () => {
    const res = await post({ input: caldwellDesign, width: { min: 10, max: 16, steps: 2 }, rates });
    expect(res.status).toBe(200);
    const local = cheapestDesign({
      study: toSI(caldwellDesign),
      width: { min: 10 * 0.3048, max: 16 * 0.3048, steps: 2 },
      rates,
    });
    res.body.widths.forEach((w: number, i: number) => expectRel(w, local.widths[i]!, 1e-12));
    expectRel(res.body.best.cost, local.best!.cost, 1e-9);
  });
  it('refuses bad limits, rates and overrides with a 422 naming the field', async () => {
    const bad = [
      [{ input: demo, width: { min: 20, max: 10 }, rates }, 'width.max'],
      [{ input: demo, width: { min: 1, max: 400 }, rates }, 'width.max'],
      [{ input: demo, width: { min: 1, max: 10, steps: 500 }, rates }, 'width.steps'],
      [
        { input: demo, width: { min: 1, max: 10 }, rates: { byKind: { concrete: -5 } } },
        'rates.byKind.concrete',
      ],
      [
        { input: demo, width: { min: 1, max: 10 }, rates, overrides: { workingRoom: 'wide' } },
        'overrides',
      ],
      [{ width: { min: 1, max: 10 }, rates }, 'input'],
    ] as const;
    for (const [body, field] of bad) {
      const res = await post(body);
      expect(res.status, JSON.stringify(body).slice(0, 80)).toBe(422);
      expect(res.body.code).toBe('validation_error');
      expect(Object.keys(res.body.details ?? {}).some((k) => k.startsWith(field))).toBe(true);
    }
  });
  it('needs a signed-in member', async () => {
    const res = await post({ input: demo, width: { min: 10, max: 12 }, rates }, null);
    expect(res.status).toBe(401);
  });
});
