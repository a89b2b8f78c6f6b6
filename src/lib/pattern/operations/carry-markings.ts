import { pointRotateAbout, segmentMapPoints, type Vec } from '../kernel';
import type { Dart, Piece, Pleat } from '../piece-schema';

/** A rigid motion: rotation by angleRad about center, then translation by offset. */
export interface RigidMotion {
	readonly center: Vec;
	readonly angleRad: number;
	readonly offset: Vec;
}

export const IDENTITY_MOTION: RigidMotion = { center: { x: 0, y: 0 }, angleRad: 0, offset: { x: 0, y: 0 } };

export function motionApply(m: RigidMotion, p: Vec): Vec {
	const r = m.angleRad === 0 ? p : pointRotateAbout(p, m.center, m.angleRad);
	return m.offset.x === 0 && m.offset.y === 0 ? r : { x: r.x + m.offset.x, y: r.y + m.offset.y };
}

const isIdentity = (m: RigidMotion) => m.angleRad === 0 && m.offset.x === 0 && m.offset.y === 0;

/** Rotation about a centre as a motion. */
export const rotationMotion = (center: Vec, angleRad: number): RigidMotion => ({ center, angleRad, offset: { x: 0, y: 0 } });

/**
 * Carry the markings of a piece along with the rigid motion of the part they sit on.
 * `motionForPoint(p)` gives the motion of the part that holds p.
 * A marking made of several points moves as one (by the motion at its first or middle point).
 * With `grainlineKeepsDirection` the grainline only follows its part's displacement and never turns:
 * it stays parallel to the fold or centre line it was drawn from (reference-values row 27, C).
 */
export function carryMarkings(
	piece: Piece,
	motionForPoint: (p: Vec) => RigidMotion,
	skipDartIds: ReadonlySet<string>,
	fixedPoints: readonly Vec[] = [],
	options: { grainlineKeepsDirection?: boolean } = {}
): Pick<Piece, 'apexes' | 'darts' | 'pleats' | 'notches' | 'grainline' | 'foldLine' | 'internalLines' | 'drillHoles' | 'labels'> {
	type M = RigidMotion;
	const rotationForPoint = motionForPoint;
	const rp = (p: Vec, a: M): Vec => (isIdentity(a) ? p : motionApply(a, p));
	const mid = (a: Vec, b: Vec): Vec => ({ x: (a.x + b.x) / 2, y: (a.y + b.y) / 2 });
	const dartRot = (d: Dart) => rotationForPoint(d.leg1End);
	const pleatRot = (p: Pleat) => rotationForPoint(p.leg1End);
	const apexes = piece.apexes.map((apex) => {
		if (fixedPoints.some((f) => f.x === apex.point.x && f.y === apex.point.y)) return apex;
		const d = piece.darts.find((x) => x.apexId === apex.id && !skipDartIds.has(x.id));
		const pl = piece.pleats.find((x) => x.apexId === apex.id);
		const a = d ? dartRot(d) : pl ? pleatRot(pl) : rotationForPoint(apex.point);
		return { ...apex, point: rp(apex.point, a) };
	});
	const darts = piece.darts.map((d) => {
		if (skipDartIds.has(d.id)) return d;
		const a = dartRot(d);
		if (isIdentity(a)) return d;
		return {
			...d,
			leg1End: rp(d.leg1End, a),
			leg2End: rp(d.leg2End, a),
			pullBack: d.pullBack ? { ...d.pullBack, sewnPoint: rp(d.pullBack.sewnPoint, a) } : undefined,
			cap: d.cap
				? { ...d.cap, peak: rp(d.cap.peak, a), edges: { segments: d.cap.edges.segments.map((s) => segmentMapPoints(s, (q) => rp(q, a))) } }
				: undefined
		};
	});
	const pleats = piece.pleats.map((p) => {
		const a = pleatRot(p);
		if (isIdentity(a)) return p;
		const line = (l: { from: Vec; to: Vec }) => ({ from: rp(l.from, a), to: rp(l.to, a) });
		return {
			...p,
			leg1End: rp(p.leg1End, a),
			leg2End: rp(p.leg2End, a),
			pivot1: p.pivot1 ? rp(p.pivot1, a) : undefined,
			pivot2: p.pivot2 ? rp(p.pivot2, a) : undefined,
			foldLine: line(p.foldLine),
			placementLine: line(p.placementLine),
			foldArrow: line(p.foldArrow)
		};
	});
	const notches = piece.notches.map((nt) => ({ ...nt, at: rp(nt.at, rotationForPoint(nt.at)) }));
	const grainline = piece.grainline
		? (() => {
				const m = mid(piece.grainline.from, piece.grainline.to);
				let a = rotationForPoint(m);
				if (options.grainlineKeepsDirection && a.angleRad !== 0) {
					const moved = motionApply(a, m);
					a = { center: m, angleRad: 0, offset: { x: moved.x - m.x, y: moved.y - m.y } };
				}
				return { ...piece.grainline, from: rp(piece.grainline.from, a), to: rp(piece.grainline.to, a) };
			})()
		: null;
	const foldLine = piece.foldLine
		? (() => {
				const a = rotationForPoint(mid(piece.foldLine.from, piece.foldLine.to));
				return { from: rp(piece.foldLine.from, a), to: rp(piece.foldLine.to, a) };
			})()
		: null;
	const internalLines = piece.internalLines.map((l) => {
		const s = l.path.segments;
		const a = rotationForPoint(mid(s[0].p0, s[s.length - 1].kind === 'line' ? (s[s.length - 1] as { p1: Vec }).p1 : (s[s.length - 1] as { p3: Vec }).p3));
		return isIdentity(a) ? l : { ...l, path: { segments: s.map((seg) => segmentMapPoints(seg, (q) => rp(q, a))) } };
	});
	const drillHoles = piece.drillHoles.map((h) => ({ ...h, at: rp(h.at, rotationForPoint(h.at)) }));
	const labels = piece.labels.map((l) => {
		const a = rotationForPoint(l.at);
		return isIdentity(a) ? l : { ...l, at: rp(l.at, a), angleRad: l.angleRad + a.angleRad };
	});
	return { apexes, darts, pleats, notches, grainline, foldLine, internalLines, drillHoles, labels };
}
