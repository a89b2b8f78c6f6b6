/** The geometry kernel: pure functions on points, segments, outlines and paths (mm, y down, radians). */
export * from './types';
export * from './tolerance';
export * from './vec';
export * from './angle';
export * from './segment';
export * from './segment-length';
export * from './roots';
export * from './bbox';
export * from './outline-area';
export * from './outline-length';
export * from './transform';
export * from './path';
export {
	locationNormalize,
	locationsSortAlong,
	pathBetween,
	outlineBetween,
	outlineSplitAt,
	pathSplitAt,
	segmentSplitAtMany
} from './split';
export * from './intersect';
export { outlineSelfIntersections, outlineSelfIntersectionsByAllPairs, outlineSelfIntersectionsByGrid, segmentSelfIntersection } from './self-intersect';
export { outlineSelfIntersectionsBetweenParts } from './self-intersect-parts';
export * from './point-in';
export * from './checks';
export * from './flatten';
export * from './simplify';
export * from './nearest';
export * from './snap';
