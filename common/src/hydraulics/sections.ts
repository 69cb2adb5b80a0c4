// Cross-section geometry of prismatic channels. SI (m, m²). Formulas: Chow 1959,
// Open-Channel Hydraulics, table 2-1; circular centroid moment from plane geometry.
import { InputError } from '../errors';
import { requireFinite, requireNonNegative, requirePositive } from './guards';

export type Section =
  | { shape: 'rectangular'; width: number }
  | { shape: 'trapezoidal'; bottomWidth: number; sideSlope: number } // z, horizontal per 1 vertical
  | { shape: 'circular'; diameter: number };

/** Geometry of a section at one depth. */
export interface SectionProperties {
  /** flow area A, m² */
  area: number;
  /** top width T, m */
  topWidth: number;
  /** wetted perimeter P, m */
  wettedPerimeter: number;
  /** hydraulic radius R = A/P, m */
  hydraulicRadius: number;
  /** first moment of area about the free surface, A·ȳ, m³ */
  centroidMoment: number;
}

/** Throws a RangeError naming the bad field; returns the section for chaining. */
export function validateSection(section: Section): Section {
  if (section === null || typeof section !== 'object') {
    throw new InputError('section', 'missing', 'section must be an object with a shape', {});
  }
  switch (section.shape) {
    case 'rectangular':
      requirePositive('section.width', section.width);
      return section;
    case 'trapezoidal':
      requireNonNegative('section.bottomWidth', section.bottomWidth);
      requireNonNegative('section.sideSlope', section.sideSlope);
      if (section.bottomWidth === 0 && section.sideSlope === 0) {
        throw new InputError(
          'section',
          'invalid',
          'section: a trapezoid needs bottomWidth > 0 or sideSlope > 0',
          {},
        );
      }
      return section;
    case 'circular':
      requirePositive('section.diameter', section.diameter);
      return section;
    default:
      throw new InputError(
        'section.shape',
        'unknown-option',
        `section.shape must be 'rectangular', 'trapezoidal' or 'circular' (got ${String((section as { shape?: unknown }).shape)})`,
        {},
      );
  }
}

/** Greatest depth the section can hold (Infinity for open channels). */
export function maxDepth(section: Section): number {
  return section.shape === 'circular' ? section.diameter : Infinity;
}

function checkDepth(section: Section, y: number): void {
  requirePositive('y', y);
  if (section.shape === 'circular' && y > section.diameter * (1 + 1e-12)) {
    throw new InputError(
      'y',
      'conduit-full',
      `y (depth) ${y} m exceeds the conduit diameter ${section.diameter} m: the conduit would run full`,
      { depth: y, diameter: section.diameter },
    );
  }
}

/** Unchecked geometry: callers have validated section and depth. Hot path of the solvers. */
export function geometry(section: Section, y: number): SectionProperties {
  switch (section.shape) {
    case 'rectangular': {
      const b = section.width;
      const area = b * y;
      const p = b + 2 * y;
      return {
        area,
        topWidth: b,
        wettedPerimeter: p,
        hydraulicRadius: area / p,
        centroidMoment: (b * y * y) / 2,
      };
    }
    case 'trapezoidal': {
      const b = section.bottomWidth;
      const z = section.sideSlope;
      const area = b * y + z * y * y;
      const p = b + 2 * y * Math.sqrt(1 + z * z);
      return {
        area,
        topWidth: b + 2 * z * y,
        wettedPerimeter: p,
        hydraulicRadius: area / p,
        centroidMoment: (b * y * y) / 2 + (z * y * y * y) / 3,
      };
    }
    case 'circular': {
      const d = section.diameter;
      const yy = Math.min(y, d);
      const theta = 2 * Math.acos(Math.max(-1, Math.min(1, 1 - (2 * yy) / d)));
      const half = theta / 2;
      const s = Math.sin(half);
      const area = (d * d * (theta - Math.sin(theta))) / 8;
      const p = (d * theta) / 2;
      return {
        area,
        topWidth: d * s,
        wettedPerimeter: p,
        hydraulicRadius: area / p,
        centroidMoment: (d * d * d * (3 * s - s * s * s - 3 * half * Math.cos(half))) / 24,
      };
    }
  }
}

/**
 * Area, top width, wetted perimeter, hydraulic radius and A·ȳ at depth y (m).
 * @example sectionProperties({ shape: 'rectangular', width: 3 }, 1).area // 3 m²
 */
export function sectionProperties(section: Section, y: number): SectionProperties {
  validateSection(section);
  requireFinite('y', y);
  checkDepth(section, y);
  return geometry(section, y);
}

/** Flow area A (m²) at depth y (m). @example area({shape:'rectangular',width:2}, 0.5) // 1 */
export function area(section: Section, y: number): number {
  return sectionProperties(section, y).area;
}
/** Top width T (m) at depth y (m). */
export function topWidth(section: Section, y: number): number {
  return sectionProperties(section, y).topWidth;
}
/** Wetted perimeter P (m) at depth y (m). */
export function wettedPerimeter(section: Section, y: number): number {
  return sectionProperties(section, y).wettedPerimeter;
}
/** Hydraulic radius R = A/P (m) at depth y (m). */
export function hydraulicRadius(section: Section, y: number): number {
  return sectionProperties(section, y).hydraulicRadius;
}
/** First moment of the flow area about the water surface, A·ȳ (m³). */
export function centroidMoment(section: Section, y: number): number {
  return sectionProperties(section, y).centroidMoment;
}
/** Depth of the centroid below the water surface, ȳ (m). */
export function centroidDepth(section: Section, y: number): number {
  const p = sectionProperties(section, y);
  return p.centroidMoment / p.area;
}
