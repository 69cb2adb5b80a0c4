// Rows of blocks across a basin: a whole number of blocks with half a space at each wall.
import { InputError } from '../errors';
import { reqPositive } from './guards';
import { ENGINE_LIMITS } from '../schemas/limits';

/** A row of blocks as built across the basin width (m). */
export interface BlockRow {
  count: number;
  /** block width across the flow, m */
  width: number;
  /** as-built clear space between blocks, m (the rule's spacing enlarged to fit the width) */
  spacing: number;
  /** the spacing the rule asked for, m */
  nominalSpacing: number;
  /** clear space between each wall and the nearest block, m (half the as-built spacing) */
  wallSpace: number;
  /** block centres measured across the basin from its centre line, m */
  centres: number[];
  /** share of the basin width the blocks occupy (0–1) */
  widthFraction: number;
  /** true when the basin is too narrow for one block and its space: one block of at most W/2 is used */
  narrow?: boolean;
  /** a staggered row's clear spaces at the −y and +y walls, m (wallSpace is the smaller) */
  wallSpaces?: [number, number];
  /** a staggered row: how many of its blocks stand behind an opening of the row upstream */
  behindOpenings?: number;
}

/**
 * Fits n blocks of width w with clear spacing ≥ s across a basin of width W, half a space at
 * each wall: n·(w + s′) = W, n = ⌊W/(w + s)⌋, s′ = W/n − w. [USBR EM-25 layout rule: "half
 * space at the walls"]. The count and spacing are found first, in constant memory; a row of
 * more than ENGINE_LIMITS.maxBlocksPerRow blocks is refused (RangeError naming basinWidth)
 * before any centre is listed, so no input can make the row's memory grow without bound.
 * @example fitBlockRow(12, 0.5, 0.5).count // 12
 */
export function fitBlockRow(basinWidth: number, blockWidth: number, spacing: number): BlockRow {
  const W = reqPositive('basinWidth', basinWidth);
  const w = reqPositive('blockWidth', blockWidth);
  const s = reqPositive('spacing', spacing);
  const fits = Math.floor(W / (w + s) + 1e-9);
  if (fits > ENGINE_LIMITS.maxBlocksPerRow)
    throw new InputError(
      'basinWidth',
      'too-many-blocks',
      `basinWidth: a row of ${fits} blocks ${w.toPrecision(3)} m wide across ${W} m exceeds the ${ENGINE_LIMITS.maxBlocksPerRow} one row may hold; the basin is far wider than its flow needs`,
      { count: fits, max: ENGINE_LIMITS.maxBlocksPerRow },
    );
  if (w + s > W * (1 + 1e-9)) {
    const bw = Math.min(w, W / 2);
    return {
      count: 1,
      width: bw,
      spacing: W - bw,
      nominalSpacing: s,
      wallSpace: (W - bw) / 2,
      centres: [0],
      widthFraction: bw / W,
      narrow: true,
    };
  }
  const count = Math.max(1, fits);
  const asBuilt = W / count - w;
  const centres: number[] = [];
  for (let k = 0; k < count; k++) centres.push(-W / 2 + asBuilt / 2 + w / 2 + k * (w + asBuilt));
  return {
    count,
    width: w,
    spacing: asBuilt,
    nominalSpacing: s,
    wallSpace: asBuilt / 2,
    centres,
    widthFraction: (count * w) / W,
  };
}

/**
 * A row staggered with `reference`: one block behind each opening between its blocks (SAF
 * floor blocks, Type III baffle piers placed "staggered" with the chute blocks). Blocks that
 * would overlap a neighbour or a wall are dropped.
 */
export function staggeredRow(
  basinWidth: number,
  reference: BlockRow,
  blockWidth: number,
): BlockRow {
  const W = reqPositive('basinWidth', basinWidth);
  const w = reqPositive('blockWidth', blockWidth);
  const centres: number[] = [];
  for (let k = 0; k + 1 < reference.centres.length; k++) {
    const c = (reference.centres[k]! + reference.centres[k + 1]!) / 2;
    const prev = centres[centres.length - 1];
    if (Math.abs(c) + w / 2 > W / 2 + 1e-12) continue;
    if (prev !== undefined && c - prev < w) continue;
    centres.push(c);
  }
  if (centres.length === 0) return fitBlockRow(W, w, w);
  const pitch = centres.length > 1 ? centres[1]! - centres[0]! : W;
  const spacing = centres.length > 1 ? pitch - w : W - w;
  const wallSpace = W / 2 + centres[0]! - w / 2;
  return {
    count: centres.length,
    width: w,
    spacing,
    nominalSpacing: reference.spacing,
    wallSpace,
    centres,
    widthFraction: (centres.length * w) / W,
  };
}

/**
 * A row staggered with `reference` at its own rule's width and spacing: each block stands
 * behind an opening of `reference` (centred between two of its blocks), at every m-th opening
 * with m the fewest that keeps the clear spacing at least `spacing`, and the pattern placed to
 * hold the most blocks, then the most evenly between the walls. Type III baffle piers
 * "staggered" with the chute blocks [mem: EM-25]: the as-built spacing is a whole number of
 * chute-block pitches less the pier width, so it can exceed the rule's, as the fitted rows' do.
 * Falls back to the rule's own fit (`behindOpenings` 0) when there is no opening to stand behind.
 */
export function staggerBehind(
  basinWidth: number,
  reference: BlockRow,
  blockWidth: number,
  spacing: number,
): BlockRow {
  const W = reqPositive('basinWidth', basinWidth);
  const w = reqPositive('blockWidth', blockWidth);
  const s = reqPositive('spacing', spacing);
  const openings: number[] = [];
  for (let k = 0; k + 1 < reference.centres.length; k++) {
    const o = (reference.centres[k]! + reference.centres[k + 1]!) / 2;
    if (Math.abs(o) + w / 2 <= W / 2 + 1e-12) openings.push(o);
  }
  const plain = (): BlockRow => ({ ...fitBlockRow(W, w, s), behindOpenings: 0 });
  if (openings.length === 0) return plain();
  const pitch = reference.width + reference.spacing;
  const m = Math.max(1, Math.ceil((w + s) / pitch - 1e-9));
  let best: number[] = [];
  let bestImbalance = Infinity;
  for (let start = 0; start < Math.min(m, openings.length); start++) {
    const centres = openings.filter((_, k) => k >= start && (k - start) % m === 0);
    const imbalance = Math.abs(W / 2 + centres[0]! - (W / 2 - centres[centres.length - 1]!));
    if (
      centres.length > best.length ||
      (centres.length === best.length && imbalance < bestImbalance - 1e-12)
    ) {
      best = centres;
      bestImbalance = imbalance;
    }
  }
  const left = W / 2 + best[0]! - w / 2;
  const right = W / 2 - best[best.length - 1]! - w / 2;
  return {
    count: best.length,
    width: w,
    spacing: best.length > 1 ? m * pitch - w : left + right,
    nominalSpacing: s,
    wallSpace: Math.min(left, right),
    wallSpaces: [left, right],
    centres: best,
    widthFraction: (best.length * w) / W,
    behindOpenings: best.length,
  };
}
