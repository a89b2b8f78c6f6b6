import { pathBoundingBox, segmentLength, segmentPointAt, segmentTangentAt, type Vec } from '../kernel';
import type { SeamMetrics } from '../metrics';
import type { Piece } from '../piece-schema';

/**
 * Names for the seams of a piece (stretches between corners, darts folded out), by where they run on
 * the piece, so that a comparison says "side seam" or "armhole" rather than "seam 3". The piece model
 * does not store seam names: they are read from the shape, in the drafting frame's terms (the centre
 * line on the piece's centre side, y down). Where the shape does not say, the name says where the seam
 * lies ("lower edge", "panel seam toward the side") rather than guess a trade name.
 *
 * Rules, in order (u = position across the piece's box, 0 at the centre side, v = 0 at the top):
 *  - centre front / centre back / centre line: runs up and down within 5 % of the centre side
 *    ("on the fold" when the piece's fold line lies along it);
 *  - (curved: longer than its chord by more than 0.5 %)
 *  - neckline: curved, starts at the centre side, in the upper third;
 *  - shoulder: straight, not at the centre, its middle in the top quarter, not steep;
 *  - armhole: curved, its middle beyond 40 % across and in the upper 70 %, not running across;
 *  - side seam: runs up and down on the outer side, starting where an armhole ends heading outward
 *    (the underarm);
 *  - other seams steeper than 45°: panel seam toward the centre / toward the side;
 *  - the rest: waist when it runs across at the bottom of a tall piece (height ≥ 1.5 × width, a
 *    bodice or panel reaching the waist), else lower edge; upper edge at the top; else edge.
 * Names that would repeat get "upper"/"lower" (or a number) added.
 */

export type SeamName = string;

/** What naming needs of a seam: its ends and its outline segments (any grouping of the stitching line). */
export type SeamStretch = Pick<SeamMetrics, 'startPoint' | 'endPoint' | 'segmentIndices'>;

interface SeamShape {
	readonly start: Vec;
	readonly end: Vec;
	readonly mid: Vec;
	readonly lengthMm: number;
	readonly curved: boolean;
	readonly startTangent: Vec;
	readonly endTangent: Vec;
}

function seamShape(piece: Piece, seam: SeamStretch): SeamShape {
	const segs = seam.segmentIndices.map((i) => piece.outline.segments[i]);
	const lengths = segs.map((s) => segmentLength(s));
	const total = lengths.reduce((a, b) => a + b, 0);
	let acc = 0;
	let mid = seam.startPoint;
	for (let k = 0; k < segs.length; k++) {
		if (acc + lengths[k] >= total / 2) {
			mid = segmentPointAt(segs[k], lengths[k] > 0 ? (total / 2 - acc) / lengths[k] : 0);
			break;
		}
		acc += lengths[k];
	}
	const chord = Math.hypot(seam.endPoint.x - seam.startPoint.x, seam.endPoint.y - seam.startPoint.y);
	return {
		start: seam.startPoint,
		end: seam.endPoint,
		mid,
		lengthMm: total,
		curved: chord === 0 || total / chord > 1.005,
		startTangent: segmentTangentAt(segs[0], 0),
		endTangent: segmentTangentAt(segs[segs.length - 1], 1)
	};
}

/** Front, back or neither, from the piece's apexes and name. */
function pieceSide(piece: Piece): 'front' | 'back' | null {
	const name = piece.name.toLowerCase();
	if (/\bback\b/.test(name)) return 'back';
	if (/\bfront\b/.test(name) || piece.apexes.some((a) => a.kind === 'bust_point')) return 'front';
	if (piece.apexes.some((a) => a.kind === 'dart_pivot')) return 'back';
	return null;
}

export function seamNames(piece: Piece, seams: readonly SeamStretch[]): SeamName[] {
	const box = pathBoundingBox(piece.outline);
	const w = Math.max(1e-9, box.maxX - box.minX);
	const h = Math.max(1e-9, box.maxY - box.minY);
	// the centre side: where the fold line is, else the low-x side (the drafting frame's centre line)
	const foldX = piece.foldLine ? (piece.foldLine.from.x + piece.foldLine.to.x) / 2 : null;
	const centreAtMax = foldX !== null && foldX > (box.minX + box.maxX) / 2;
	const u = (p: Vec) => (centreAtMax ? box.maxX - p.x : p.x - box.minX) / w;
	const v = (p: Vec) => (p.y - box.minY) / h;
	const side = pieceSide(piece);
	const shapes = seams.map((s) => seamShape(piece, s));
	const upDown = (s: SeamShape) => Math.abs(s.end.y - s.start.y) > 1.5 * Math.abs(s.end.x - s.start.x);
	const steep = (s: SeamShape) => Math.abs(s.end.y - s.start.y) > Math.abs(s.end.x - s.start.x);
	const across = (s: SeamShape) => Math.abs(s.end.x - s.start.x) > 1.5 * Math.abs(s.end.y - s.start.y);
	const onFold = (s: SeamShape) => {
		if (!piece.foldLine) return false;
		const a = piece.foldLine.from;
		const b = piece.foldLine.to;
		const len = Math.hypot(b.x - a.x, b.y - a.y) || 1;
		const off = (p: Vec) => Math.abs((p.x - a.x) * (b.y - a.y) - (p.y - a.y) * (b.x - a.x)) / len;
		return off(s.start) < 1 && off(s.end) < 1 && off(s.mid) < 1;
	};

	const names: string[] = shapes.map((s) => {
		if (upDown(s) && Math.max(u(s.start), u(s.end), u(s.mid)) < 0.05) {
			const base = side === 'front' ? 'centre front' : side === 'back' ? 'centre back' : 'centre line';
			return onFold(s) ? `${base} (on the fold)` : base;
		}
		if (s.curved && Math.min(u(s.start), u(s.end)) < 0.05 && v(s.mid) < 0.34 && !upDown(s)) return 'neckline';
		if (!s.curved && v(s.mid) < 0.25 && !upDown(s) && Math.min(u(s.start), u(s.end)) > 0.1) return 'shoulder';
		if (s.curved && u(s.mid) > 0.4 && v(s.mid) < 0.7 && !across(s)) return 'armhole';
		return '';
	});
	// side seams: up and down on the outer side, leaving the lower end of an armhole that heads outward
	shapes.forEach((s, i) => {
		if (names[i] || !upDown(s) || u(s.mid) < 0.5) return;
		const n = shapes.length;
		const prev = (i - 1 + n) % n;
		const next = (i + 1) % n;
		const outward = (t: Vec) => Math.abs(t.x) > Math.abs(t.y);
		const fromArmhole =
			(names[prev] === 'armhole' && outward(shapes[prev].endTangent) && v(shapes[prev].end) <= v(s.end)) ||
			(names[next] === 'armhole' && outward(shapes[next].startTangent) && v(shapes[next].start) <= v(s.start));
		if (fromArmhole) names[i] = 'side seam';
	});
	const tall = h >= 1.5 * w;
	shapes.forEach((s, i) => {
		if (names[i]) return;
		if (steep(s)) names[i] = u(s.mid) < 0.5 ? 'panel seam toward the centre' : 'panel seam toward the side';
		else if (v(s.mid) > 0.7) names[i] = tall && across(s) ? 'waist' : 'lower edge';
		else if (v(s.mid) < 0.3) names[i] = 'upper edge';
		else names[i] = 'edge';
	});
	return distinct(names, shapes, v);
}

/** Repeated names get "upper"/"lower" when there are two at different heights, else a number. */
function distinct(names: string[], shapes: readonly SeamShape[], v: (p: Vec) => number): string[] {
	const out = [...names];
	const groups = new Map<string, number[]>();
	names.forEach((n, i) => groups.set(n, [...(groups.get(n) ?? []), i]));
	for (const [name, idx] of groups) {
		if (idx.length < 2) continue;
		const byHeight = [...idx].sort((a, b) => v(shapes[a].mid) - v(shapes[b].mid));
		if (idx.length === 2 && Math.abs(v(shapes[byHeight[0]].mid) - v(shapes[byHeight[1]].mid)) > 0.05) {
			out[byHeight[0]] = `${name}, upper`;
			out[byHeight[1]] = `${name}, lower`;
		} else byHeight.forEach((i, k) => (out[i] = `${name} ${k + 1}`));
	}
	return out;
}
