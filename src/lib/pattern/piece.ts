import {
	vecAngleBetween,
	vecDistance,
	vecLength,
	vecNormalize,
	vecSub,
	vecAdd,
	vecScale,
	type Outline,
	type Vec
} from './kernel';
import { pieceSchema, type Apex, type Dart, type Piece, type PieceInput, type Pleat } from './piece-schema';

/** Tolerance for recognising the same point (leg ends, apex vertices) after exact operations. */
export const POINT_MATCH_TOLERANCE_MM = 1e-4;

/** Parse and validate piece data (throws a ZodError on bad data). */
export function parsePiece(input: unknown): Piece {
	return pieceSchema.parse(input);
}

export function pieceFromInput(input: PieceInput): Piece {
	return pieceSchema.parse(input);
}

export function apexById(piece: Piece, apexId: string): Apex | undefined {
	return piece.apexes.find((a) => a.id === apexId);
}

export function dartById(piece: Piece, dartId: string): Dart | undefined {
	return piece.darts.find((d) => d.id === dartId);
}

export function pointsMatch(a: Vec, b: Vec, toleranceMm = POINT_MATCH_TOLERANCE_MM): boolean {
	return vecDistance(a, b) <= toleranceMm;
}

/**
 * Index of the outline segment that runs from `leg1End` to `apex` and is followed by the segment
 * from `apex` to `leg2End` (both straight). -1 if the wedge is not in the outline.
 */
export function wedgeSegmentIndex(outline: Outline, apex: Vec, leg1End: Vec, leg2End: Vec): number {
	const segs = outline.segments;
	const n = segs.length;
	// the apex is matched first, in place (squared distance): the scan runs over every vertex
	const tol2 = POINT_MATCH_TOLERANCE_MM * POINT_MATCH_TOLERANCE_MM;
	const ax = apex.x;
	const ay = apex.y;
	for (let i = 0; i < n; i++) {
		const a = segs[i];
		if (a.kind !== 'line') continue;
		const dx = a.p1.x - ax;
		const dy = a.p1.y - ay;
		if (!(dx * dx + dy * dy <= tol2)) continue;
		const b = segs[i + 1 === n ? 0 : i + 1];
		if (b.kind !== 'line' || !pointsMatch(a.p1, apex) || !pointsMatch(a.p0, leg1End) || !pointsMatch(b.p1, leg2End)) continue;
		return i;
	}
	return -1;
}

/** Like wedgeSegmentIndex for a pleat opening, which may pass through substitute pivots. */
export function pleatWedgeSegmentRange(outline: Outline, apex: Vec, pleat: Pleat): { first: number; count: number } | null {
	const pts: Vec[] = [pleat.leg1End];
	if (pleat.pivot1) pts.push(pleat.pivot1);
	pts.push(apex);
	if (pleat.pivot2) pts.push(pleat.pivot2);
	pts.push(pleat.leg2End);
	const segs = outline.segments;
	const n = segs.length;
	const count = pts.length - 1;
	for (let i = 0; i < n; i++) {
		let ok = true;
		for (let k = 0; k < count && ok; k++) {
			const s = segs[(i + k) % n];
			ok = s.kind === 'line' && pointsMatch(s.p0, pts[k]) && pointsMatch(s.p1, pts[k + 1]);
		}
		if (ok) return { first: i, count };
	}
	return null;
}

/** Geometry of a wedge (dart or pleat opening) about its apex. */
export interface WedgeGeometry {
	readonly apex: Vec;
	readonly leg1End: Vec;
	readonly leg2End: Vec;
	/** Unsigned opening angle, in [0, π]. */
	readonly angleRad: number;
	/** Signed rotation that turns the leg2 direction onto the leg1 direction (closes the wedge). */
	readonly closingRotationRad: number;
	readonly leg1LengthMm: number;
	readonly leg2LengthMm: number;
	/** Straight distance between the leg ends (intake at the edge). */
	readonly intakeMm: number;
	/** Unit vector from the apex along the bisector, toward the mouth. */
	readonly bisector: Vec;
}

export function wedgeGeometry(apex: Vec, leg1End: Vec, leg2End: Vec): WedgeGeometry {
	const d1 = vecSub(leg1End, apex);
	const d2 = vecSub(leg2End, apex);
	const closing = vecAngleBetween(d2, d1);
	const u1 = vecNormalize(d1);
	const u2 = vecNormalize(d2);
	let bis = vecAdd(u1, u2);
	if (vecLength(bis) < 1e-12) bis = { x: -u1.y, y: u1.x };
	return {
		apex,
		leg1End,
		leg2End,
		angleRad: Math.abs(closing),
		closingRotationRad: closing,
		leg1LengthMm: vecLength(d1),
		leg2LengthMm: vecLength(d2),
		intakeMm: vecDistance(leg1End, leg2End),
		bisector: vecNormalize(bis)
	};
}

export function dartGeometry(piece: Piece, dart: Dart): WedgeGeometry | null {
	const apex = apexById(piece, dart.apexId);
	if (!apex) return null;
	return wedgeGeometry(apex.point, dart.leg1End, dart.leg2End);
}

export function pleatGeometry(piece: Piece, pleat: Pleat): WedgeGeometry | null {
	const apex = apexById(piece, pleat.apexId);
	if (!apex) return null;
	return wedgeGeometry(apex.point, pleat.leg1End, pleat.leg2End);
}

/**
 * Structural problems of a piece (beyond the schema): an outline that does not close, missing apexes,
 * wedges not in the outline. `outlineClosed`: the caller has just found every gap within 1e-3 mm.
 */
export function pieceStructureProblems(piece: Piece, known: { outlineClosed?: boolean } = {}): string[] {
	const problems: string[] = [];
	const ids = new Set<string>();
	const dup = (kind: string, id: string) => {
		const key = `${kind}:${id}`;
		if (ids.has(key)) problems.push(`${kind} id "${id}" is used twice`);
		ids.add(key);
	};
	const segs = piece.outline.segments;
	const n = segs.length;
	for (let i = 0; i < (known.outlineClosed ? 0 : n); i++) {
		const s = segs[i];
		const end = s.kind === 'line' ? s.p1 : s.p3;
		const next = segs[i + 1 === n ? 0 : i + 1].p0;
		const gx = end.x - next.x;
		const gy = end.y - next.y;
		// squared, in place (this runs over every vertex); NaN passes here as it did (the outline checks report it)
		if (gx * gx + gy * gy > 1e-6 && vecDistance(end, next) > 1e-3) {
			problems.push(`outline is not closed between segment ${i} and segment ${(i + 1) % n}`);
		}
	}
	for (const a of piece.apexes) dup('apex', a.id);
	for (const d of piece.darts) {
		dup('dart', d.id);
		const apex = apexById(piece, d.apexId);
		if (!apex) {
			problems.push(`dart "${d.id}" refers to apex "${d.apexId}", which is not on the piece`);
			continue;
		}
		if (wedgeSegmentIndex(piece.outline, apex.point, d.leg1End, d.leg2End) < 0) {
			problems.push(`dart "${d.id}": the outline does not run leg end → apex → leg end at this dart`);
		}
	}
	for (const p of piece.pleats) {
		dup('pleat', p.id);
		const apex = apexById(piece, p.apexId);
		if (!apex) {
			problems.push(`pleat "${p.id}" refers to apex "${p.apexId}", which is not on the piece`);
			continue;
		}
		if (!pleatWedgeSegmentRange(piece.outline, apex.point, p)) {
			problems.push(`pleat "${p.id}": its opening is not in the outline`);
		}
	}
	return problems;
}

/** A point at distance `distanceMm` from `from` toward `to`. */
export function pointToward(from: Vec, to: Vec, distanceMm: number): Vec {
	return vecAdd(from, vecScale(vecNormalize(vecSub(to, from)), distanceMm));
}
