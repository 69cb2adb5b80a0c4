// Sizing of the jump basins (USBR I–IV, SAF) for one discharge: hydraulics.md §4.
import { InputError } from '../errors';
import { belangerRatio } from '../hydraulics';
import { G } from '../units/constants';
import { getDissipator, isJumpBasinType } from './catalogue';
import { resolveDefaults, type BasinDefaults } from './defaults';
import { freeboard as usbrFreeboard } from './freeboard';
import { reqNonNegative, reqPositive } from './guards';
import type { JumpBasinSizing, JumpBasinType, JumpRules } from './types';
import { warn, type StudyWarning } from '../warnings';
import { len, lim, udis, vel } from './types/shared';

export interface SizeJumpBasinOptions {
  /** overrides of the from-memory defaults */
  defaults?: Partial<BasinDefaults>;
  /** largest tailwater depth above the floor, m (walls are raised to clear it) */
  maxTailwaterDepth?: number;
}

/** What a sizing warning is about: a range-wide design says each topic once (design.ts). */
export type JumpWarningTopic =
  'froude' | 'oscillating' | 'cavitation' | 'velocity' | 'unitDischarge' | 'length' | 'narrow';

/** A sizing warning with its topic. */
export interface JumpWarning {
  topic: JumpWarningTopic;
  warning: StudyWarning;
}

/** What a jump basin's rules give at one discharge (SI), before its appurtenances. */
export interface JumpBasinHydraulics {
  q: number;
  v1: number;
  fr1: number;
  /** sequent depth, Bélanger, m */
  y2: number;
  /** the type's tailwater factor C */
  factor: number;
  /** C·y2, m */
  requiredTailwaterDepth: number;
  /** basin length, m */
  length: number;
}

/**
 * The hydraulics of a jump basin at one discharge: q = Q/width, V1 = q/y1, Fr1 = V1/√(g·y1),
 * y2 by Bélanger [src: Chow 1959], C and the length by the type's rules. Inputs already checked
 * positive; refuses a toe that is not supercritical. The part of sizeJumpBasin that every
 * discharge of a design needs.
 */
export function jumpBasinHydraulics(
  rules: JumpRules,
  width: number,
  Q: number,
  y1: number,
  d: BasinDefaults,
): JumpBasinHydraulics {
  const q = Q / width;
  const v1 = q / y1;
  const fr1 = v1 / Math.sqrt(G * y1);
  if (fr1 <= 1)
    throw new InputError(
      'y1',
      'not-supercritical',
      `y1 ${y1} m is not supercritical at Q ${Q} m³/s over ${width} m (Fr1 = ${fr1.toPrecision(4)} ≤ 1): no jump forms`,
      { Q, fr1 },
    );
  const y2 = y1 * belangerRatio(fr1);
  const factor = rules.tailwaterFactor(fr1, d);
  return {
    q,
    v1,
    fr1,
    y2,
    factor,
    requiredTailwaterDepth: factor * y2,
    length: rules.length(fr1, y1, y2, d),
  };
}

export function jumpRules(type: JumpBasinType): JumpRules {
  const rules = getDissipator(type).jump;
  if (!rules)
    throw new InputError('type', 'unknown-option', `type "${type}" is not a jump basin`, {});
  return rules;
}

/**
 * Sizes a jump basin of rectangular section for one discharge (hydraulics.md §4):
 * Fr1 = V1/√(g·y1), V1 = Q/(width·y1); y2 by Bélanger [src: Chow 1959]; required tailwater
 * C·y2 with the type's factor; length, blocks, sill by the type's rules; freeboard 0.1·(V1 +
 * y2) in ft units [mem: Design of Small Dams] (SAF: y2/3 above tailwater [mem: Blaisdell]);
 * wall height = max(y2, tailwater) + freeboard. SI in and out.
 * @example sizeJumpBasin('usbr-3', { width: 10, Q: 40, y1: 0.4 }).length
 */
export function sizeJumpBasin(
  type: JumpBasinType,
  c: { width: number; Q: number; y1: number },
  options: SizeJumpBasinOptions = {},
): JumpBasinSizing {
  if (!isJumpBasinType(type))
    throw new InputError(
      'type',
      'unknown-option',
      `type "${String(type)}" is not a jump basin (usbr-1, usbr-2, usbr-3, usbr-4, saf)`,
      {},
    );
  if (c === null || typeof c !== 'object')
    throw new InputError('body', 'invalid', 'sizing input must be an object { width, Q, y1 }', {});
  const width = reqPositive('width', c.width);
  const Q = reqPositive('Q', c.Q);
  const y1 = reqPositive('y1', c.y1);
  const d = resolveDefaults(options.defaults);
  const rules = jumpRules(type);
  const { q, v1, fr1, y2, factor, requiredTailwaterDepth, length } = jumpBasinHydraulics(
    rules,
    width,
    Q,
    y1,
    d,
  );
  const app = rules.appurtenances({ fr1, y1, y2, width, length, d });
  const tw = Math.max(
    requiredTailwaterDepth,
    options.maxTailwaterDepth !== undefined
      ? reqNonNegative('maxTailwaterDepth', options.maxTailwaterDepth)
      : 0,
  );
  const fb = rules.freeboardRule === 'saf' ? y2 / 3 : usbrFreeboard(v1, y2, d.freeboardCoefficient);
  const wallHeight = rules.freeboardRule === 'saf' ? tw + fb : Math.max(y2, tw) + fb;
  const items = jumpWarningItems(type, { fr1, v1, q, y2, length }, rules, d);
  for (const [code, row] of [
    ['narrow-chute-blocks', app.chuteBlocks],
    ['narrow-baffle-blocks', app.baffleBlocks],
    ['narrow-sill-teeth', app.endSill.teeth],
  ] as const) {
    if (row && 'narrow' in row && row.narrow)
      items.push({ topic: 'narrow', warning: warn(code, {}, { type }) });
  }
  const warnings = items.map((w) => w.warning);
  const sizing: JumpBasinSizing = {
    type,
    fr1,
    y2,
    requiredTailwaterDepth,
    length,
    endSill: app.endSill,
    freeboard: fb,
    wallHeight,
    warnings,
    v1,
    y1,
    q,
    tailwaterFactor: factor,
    sources: [
      'Fr1 = V1/√(g·y1); y2/y1 = ½(√(1 + 8·Fr1²) − 1) [src: Chow 1959]',
      `tailwater factor ${rules.tailwaterFactorTag}`,
      `length ${rules.lengthTag}`,
      ...rules.appurtenanceTags,
      rules.freeboardRule === 'saf'
        ? 'wall top y2/3 above the largest tailwater [mem: Blaisdell 1948]'
        : 'freeboard 0.1·(V1 + y2), ft and ft/s [mem: Design of Small Dams]',
    ],
  };
  if (app.chuteBlocks) sizing.chuteBlocks = app.chuteBlocks;
  if (app.baffleBlocks) sizing.baffleBlocks = app.baffleBlocks;
  return sizing;
}

/** The cautions of a type at one discharge, as data, each with its topic. */
export function jumpWarningItems(
  type: JumpBasinType,
  r: { fr1: number; v1: number; q: number; y2: number; length: number },
  rules: JumpRules,
  d: BasinDefaults,
): JumpWarning[] {
  const w: JumpWarning[] = [];
  const at = { type };
  const add = (topic: JumpWarningTopic, warning: StudyWarning): void => {
    w.push({ topic, warning });
  };
  const [lo, hi] = rules.froudeRange;
  if (r.fr1 < lo || r.fr1 > hi) {
    add(
      'froude',
      warn('type-froude-outside', { fr1: r.fr1, lo, hi: hi === Infinity ? undefined : hi }, at),
    );
  }
  if (r.fr1 >= 2.5 && r.fr1 < 4.5 && (type === 'usbr-1' || type === 'usbr-4' || type === 'saf')) {
    add('oscillating', warn('type-oscillating', { fr1: r.fr1 }, at));
  }
  const hasBlocks = type !== 'usbr-1';
  // One velocity caution per type: the stronger "not advised" replaces the cavitation caution.
  if (type === 'usbr-3' && r.v1 > d.type3VelocityFail) {
    add(
      'velocity',
      warn('piers-not-advised', { v1: vel(r.v1), limit: lim(d, 'type3VelocityFail') }, at),
    );
  } else if (type === 'saf' && r.v1 > d.safVelocityFail) {
    add(
      'velocity',
      warn('saf-blocks-not-advised', { v1: vel(r.v1), limit: lim(d, 'safVelocityFail') }, at),
    );
  } else if (hasBlocks && r.v1 > d.cavitationVelocity) {
    add(
      'cavitation',
      warn('blocks-cavitation', { v1: vel(r.v1), limit: lim(d, 'cavitationVelocity') }, at),
    );
  }
  if (type === 'usbr-3' && r.q > d.type3MaxUnitDischarge)
    add(
      'unitDischarge',
      warn('type3-unit-discharge', { q: udis(r.q), limit: lim(d, 'type3MaxUnitDischarge') }, at),
    );
  if (type === 'usbr-2' && r.q > d.type2MaxUnitDischarge)
    add(
      'unitDischarge',
      warn('type2-unit-discharge', { q: udis(r.q), limit: lim(d, 'type2MaxUnitDischarge') }, at),
    );
  if (type === 'usbr-1' && r.fr1 > 9) {
    add('length', warn('plain-apron-long', { fr1: r.fr1, length: len(r.length) }, at));
  }
  return w;
}
