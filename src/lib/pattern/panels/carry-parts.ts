import { outlineContainsPoint, outlineFlatten, outlineNearestPoint, pathBetween, pathIntersections, type Path, type Vec } from '../kernel';
import type { Piece, Pleat } from '../piece-schema';
import { dist, polygonCentroid } from './chain-tools';
import { panelRefuse, type PanelFailure } from './panel-types';
import { pieceProblems } from './piece-tools';
import { separate } from './separate';
import type { CarryPlacement } from './carry-types';

/** Carry's first step, cutting every panel along the style line, and the small helpers of its joins. */

/** One panel cut along the style line: the part on the chosen side, the other part, the cut. */
export interface Part {
	readonly fused: Piece;
	readonly other: Piece;
	readonly cut: Path;
}

/**
 * Every panel checked, then cut along the style line where it crosses the panel (exactly twice, edge to
 * edge); the parts sorted by side (y down: 'above' = the part whose middle has the smaller y).
 */
export function cutPanels(panels: readonly Piece[], line: Path, fuse: 'above' | 'below'): Part[] | PanelFailure {
	for (const panel of panels) {
		const problems = pieceProblems(panel);
		if (problems.length) return panelRefuse('invalid_piece', `${panel.name} has problems to fix first: ${problems[0]}`);
	}
	const parts: Part[] = [];
	for (const panel of panels) {
		const hits = pathIntersections(line, panel.outline).sort((p, q) => p.segmentIndex + p.t - (q.segmentIndex + q.t));
		if (hits.length < 2) {
			return panelRefuse('style_line_misses_panel', `The style line does not cross ${panel.name} from edge to edge; extend it across every panel.`);
		}
		if (hits.length > 2) {
			return panelRefuse('style_line_misses_panel', `The style line crosses the edge of ${panel.name} ${hits.length} times; it must cross each panel once, edge to edge.`);
		}
		const cut = pathBetween(line, hits[0], hits[hits.length - 1]);
		const s = separate(panel, { path: cut, pieceIds: [`${panel.id}-1`, `${panel.id}-2`], notchFractions: [], pieceChecked: true, crossingsChecked: true, partsSimpleByConstruction: true });
		if (!s.ok) return panelRefuse(s.error.code, `${panel.name}: ${s.error.message}`);
		const [p1, p2] = s.pieces;
		const cy = (q: Piece) => polygonCentroid(outlineFlatten(q.outline, 0.5)).y;
		const p1Above = cy(p1) < cy(p2);
		const fused = (fuse === 'above') === p1Above ? p1 : p2;
		parts.push({ fused, other: fused === p1 ? p2 : p1, cut });
	}
	return parts;
}

/** The placement of panel 0, which stays put. */
export const noMove = (p: Vec): Vec => p;

/** Which part of a cut panel a point lies in, or nearer to. */
export function nearSide(p: Vec, part: Part): 'fused' | 'other' {
	const d = (q: Piece) => (outlineContainsPoint(q.outline, p) ? 0 : outlineNearestPoint(q.outline, p).distance);
	return d(part.fused) <= d(part.other) ? 'fused' : 'other';
}

/** Where a path crosses the style line, or null. */
export function crossing(path: Path, line: Path): Vec | null {
	const hits = pathIntersections(path, line);
	return hits.length ? hits[0].point : null;
}

/** A residual left as a pair of pleats meeting at the centre line of its opening. */
export function residualPleat(id: string, apexId: string, apex: Vec, l1: Vec, l2: Vec): Pleat {
	const mouth = { x: (l1.x + l2.x) / 2, y: (l1.y + l2.y) / 2 };
	const intake = dist(l1, l2);
	return {
		id,
		apexId,
		kind: 'pleat',
		leg1End: l1,
		leg2End: l2,
		foldLine: { from: l1, to: apex },
		placementLine: { from: mouth, to: apex },
		foldToward: 'leg2',
		foldArrow: { from: l1, to: mouth },
		intakeMm: intake,
		// a pair of pleats meeting at the centre line: each takes half the intake, depth = intake/2 each (row 20)
		depthMm: intake / 4
	};
}

/** The rigid placement a point map applies (read off from where it sends two points). */
export function placementOf(panelId: string, T: (p: Vec) => Vec): CarryPlacement {
	const o = T({ x: 0, y: 0 });
	const u = T({ x: 1, y: 0 });
	return { panelId, angleRad: Math.atan2(u.y - o.y, u.x - o.x), dxMm: o.x, dyMm: o.y };
}

/** Distance from D to the line through the two crossing points (the height of the stub); where they meet, D to that point. */
export function stubHeight(D: Vec, a: Vec, b: Vec): number {
	const dx = b.x - a.x;
	const dy = b.y - a.y;
	const len = Math.hypot(dx, dy);
	if (len < 1e-9) return dist(a, D);
	return Math.abs((D.x - a.x) * dy - (D.y - a.y) * dx) / len;
}
