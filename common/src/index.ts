// The face of @basinwright/common, grouped by topic. Each area appends its own export lines.

// Hydraulics engine (SI): sections, depths, jump, inflow, tailwater, profiles, diagrams
export * from './hydraulics';
export * from './schemas';
export * from './policy';

// Units (mathjs, private instance with cfs): SI ⇄ US customary at the edges
export * from './units';

// The whole study: runStudy and its pieces (analyseRange, solveFloorElevation)
export * from './study';
// The version of runStudy's answer, stored beside a saved result
export { ENGINE_VERSION } from './version';

// Dissipators: catalogue, screening, sizing (sizeJumpBasin), exit protection, flotation, drawing (drawingToSvg)
export * from './basins';
