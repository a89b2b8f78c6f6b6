import { segmentMapPoints, type Path, type Vec } from '../kernel';

/** Kernel functions used by join, plus mapping every point of a path. */
export { outlineArea, outlineSignedArea } from '../kernel';
export type { Outline, Path, Vec } from '../kernel';

export function pathMapPoints(p: Path, f: (q: Vec) => Vec): Path {
	return { segments: p.segments.map((s) => segmentMapPoints(s, f)) };
}
