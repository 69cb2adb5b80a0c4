// The uncertainty request at the edges: depths typed in feet become metres (factors have no
// unit). The engine takes SI only, as runStudy does.
import { FOOT } from '../units/constants';
import type { UnitSystem } from '../range/types';
import type { Distribution } from './distributions';
import { UNCERTAIN_KIND } from './inputs';
import type { UncertaintyRequest } from './run';

function scaled(d: Distribution, k: number): Distribution {
  switch (d.kind) {
    case 'uniform':
      return { kind: 'uniform', low: d.low * k, high: d.high * k };
    case 'triangular':
      return { kind: 'triangular', low: d.low * k, mode: d.mode * k, high: d.high * k };
    case 'normal':
      return { kind: 'normal', mean: d.mean * k, sd: d.sd * k, low: d.low * k, high: d.high * k };
  }
}

/** The request with its depths in metres when they were typed in `units` = 'US' (feet). */
export function uncertaintyToSI(req: UncertaintyRequest, units: UnitSystem): UncertaintyRequest {
  if (units !== 'US') return req;
  return {
    ...req,
    inputs: req.inputs.map((u) =>
      UNCERTAIN_KIND[u.key] === 'depth' ? { ...u, distribution: scaled(u.distribution, FOOT) } : u,
    ),
  };
}

/** The inverse, for a form that shows SI defaults in feet. */
export function uncertaintyFromSI(req: UncertaintyRequest, units: UnitSystem): UncertaintyRequest {
  if (units !== 'US') return req;
  return {
    ...req,
    inputs: req.inputs.map((u) =>
      UNCERTAIN_KIND[u.key] === 'depth'
        ? { ...u, distribution: scaled(u.distribution, 1 / FOOT) }
        : u,
    ),
  };
}
