// POST /api/v1/calc/uncertainty (issue 12): any signed-in member of any role gets the same
// figures the engine gives (runUncertainty, checked against independent references in
// tests/common/uncertainty.test.ts); no token 401; bad input a 422 naming the field.
import { describe, expect, it } from 'vitest';
import {
  ROLES,
  defaultUncertainInputs,
  runStudy,
  runUncertainty,
  toSI,
  type StudyInput,
  type UncertaintyRequest,
} from '@basinwright/common';
import { addMember, bearer, signUpFirm, apiForFile, type SignedUp } from '../support/api-app';
import { expectRel } from '../support/tolerance';
import { caldwellDesign, fenwickDesign } from '../../seed/designs';

let owner: SignedUp;
const h = apiForFile(async () => {
  owner = await signUpFirm(h, 'uncertainty');
});

// the demo project's design input (invented demo data, seed/designs.ts)
const demo: StudyInput = fenwickDesign;
const uncertainty = {
  inputs: defaultUncertainInputs(demo),
  samples: 200,
  seed: 'fenwick',
  confidence: 0.9,
};
const post = (body: unknown, token: string | null) => {
  const req = h.http().post('/api/v1/calc/uncertainty');
  return (token === null ? req : req.set(bearer(token))).send(body as object);
};

describe('POST /api/v1/calc/uncertainty: role rows', () => {
  it('without a token: 401', async () => {
    const res = await post({ input: demo, uncertainty }, null);
    expect(res.status).toBe(401);
    expect(res.body.code).toBe('unauthorized');
  });

  it.each(ROLES.map((role) => ({ role })))(
    '$role: 200 with the engine’s own figures (same seed, same numbers)',
    async ({ role }) => {
      const token =
        role === 'owner' ? owner.token : (await addMember(h, owner.firm.id, role)).token;
      const res = await post({ input: demo, uncertainty }, token);
      expect(res.status).toBe(200);
      const local = runUncertainty(demo, uncertainty);
      expect(res.body.monteCarlo.probability).toBe(local.monteCarlo.probability);
      expect(res.body.monteCarlo.samples).toBe(200);
      expect(res.body.sensitivity.map((s: { key: string }) => s.key)).toEqual(
        local.sensitivity.map((s) => s.key),
      );
      // as designed: the deterministic study's floor (runStudy)
      expectRel(
        res.body.asDesigned.requiredElevation,
        runStudy(demo).floor.requiredElevation!,
        1e-12,
      );
    },
  );
});

describe('POST /api/v1/calc/uncertainty: units and refusals', () => {
  it('a depth typed in feet is taken in feet: the US demo lowered 1 ft answers as its SI twin lowered 0.3048 m', async () => {
    const one = (d: number): UncertaintyRequest => ({
      ...uncertainty,
      inputs: [
        { key: 'bedLowering', distribution: { kind: 'uniform', low: d, high: d }, basis: '' },
      ],
    });
    const res = await post({ input: caldwellDesign, uncertainty: one(1) }, owner.token);
    expect(res.status).toBe(200);
    const local = runUncertainty(toSI(caldwellDesign), one(0.3048)); // 1 ft = 0.3048 m (NIST)
    expectRel(res.body.sensitivity[0].floorAtHigh, local.sensitivity[0]!.floorAtHigh!, 1e-12);
    expect(res.body.sensitivity[0].changeAtHigh).toBeLessThan(0);
  });

  it('422 naming the field: too many samples, an input that does not apply, a bad distribution', async () => {
    const many = await post(
      { input: demo, uncertainty: { ...uncertainty, samples: 20_001 } },
      owner.token,
    );
    expect(many.status).toBe(422);
    expect(Object.keys(many.body.details)).toContain('uncertainty.samples');
    const shift = await post(
      {
        input: demo,
        uncertainty: {
          ...uncertainty,
          inputs: [{ key: 'ratingShift', distribution: { kind: 'uniform', low: 0, high: 0.1 } }],
        },
      },
      owner.token,
    );
    expect(shift.status).toBe(422);
    expect(JSON.stringify(shift.body.details)).toContain('uncertainty.inputs[0].key');
    const bad = await post(
      {
        input: demo,
        uncertainty: {
          ...uncertainty,
          inputs: [{ key: 'bedLowering', distribution: { kind: 'uniform', low: 1, high: 0 } }],
        },
      },
      owner.token,
    );
    expect(bad.status).toBe(422);
    expect(JSON.stringify(bad.body.details)).toContain('uncertainty.inputs[0].distribution.high');
  });
});
