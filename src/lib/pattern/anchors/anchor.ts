import { z } from 'zod';
import { segmentEnd, segmentLength, vecAdd, vecDistance, type Vec } from '../kernel';
import { pieceSeams, seamPointAt, type PieceSeam } from '../piece-seams';
import type { Piece } from '../piece-schema';
import { pieceLandmarks, type Landmark } from './landmarks';

/**
 * Anchors: a point a step uses, said so that it can be found again on another body (the same block
 * drafted for another size or another client). Three kinds:
 *  - `landmark`: a named landmark of the piece (an apex by its id, or a corner: "side neck point",
 *    "side waist", "neckline / shoulder");
 *  - `edge`: a place along a named seam, by fraction of its sewn length or by a distance (mm) from one
 *    of its ends;
 *  - `offset`: so many mm across (x) and down (y) from a landmark or an edge place.
 * `piece` says which source of a step spanning pieces the anchor is on (its index); single-piece steps
 * leave it out. Resolution is pure: the same anchor on the same piece always gives the same point.
 */

const finite = () => z.number().refine((n) => Number.isFinite(n), { message: 'must be a finite number' });
const name = z.string().min(1).max(120);
const pieceIndex = z.number().int().min(0).max(39).optional();

export const landmarkAnchorSchema = z.object({ kind: z.literal('landmark'), name, piece: pieceIndex });
export const edgeAnchorSchema = z
	.object({
		kind: z.literal('edge'),
		edge: name,
		from: z.enum(['start', 'end']).default('start'),
		fraction: finite().min(0).max(1).optional(),
		distanceMm: finite().min(0).optional(),
		piece: pieceIndex
	})
	.refine((a) => (a.fraction === undefined) !== (a.distanceMm === undefined), { message: 'give a fraction of the seam or a distance from its end, not both' });
export const offsetAnchorSchema = z.object({
	kind: z.literal('offset'),
	of: z.union([landmarkAnchorSchema, edgeAnchorSchema]),
	dxMm: finite(),
	dyMm: finite()
});
export const anchorSchema = z.union([landmarkAnchorSchema, edgeAnchorSchema, offsetAnchorSchema]);

export type LandmarkAnchor = z.output<typeof landmarkAnchorSchema>;
export type EdgeAnchor = z.output<typeof edgeAnchorSchema>;
export type OffsetAnchor = z.output<typeof offsetAnchorSchema>;
export type Anchor = z.output<typeof anchorSchema>;

/** A point as a step stores it: the absolute point on the body it was made on, and optionally its anchor. */
export const anchoredVecSchema = z.object({ x: finite(), y: finite(), anchor: anchorSchema.optional() });

/** What a body offers anchors: its landmarks and named seams, computed once per piece. */
export interface AnchorBody {
	readonly piece: Piece;
	readonly landmarks: readonly Landmark[];
	readonly seams: readonly PieceSeam[];
}

export function anchorBody(piece: Piece): AnchorBody {
	const seams = pieceSeams(piece);
	return { piece, seams, landmarks: pieceLandmarks(piece, seams) };
}

/**
 * Another body read with the base body's names: when both outlines have the same segments in the same
 * order (the same draft and steps on another size), each seam of the base is the same run of segments on
 * the target and each corner the same vertex, whatever the target's own shape would name them (the rules
 * that name seams from a piece's proportions can name an armhole differently on a much larger size).
 * Apexes keep their ids. When the outlines differ in structure the target's own names are used.
 */
export function anchorBodyLike(target: Piece, base: AnchorBody): AnchorBody {
	const segs = target.outline.segments;
	if (segs.length !== base.piece.outline.segments.length || segs.some((s, i) => s.kind !== base.piece.outline.segments[i].kind)) return anchorBody(target);
	const seams: PieceSeam[] = base.seams.map((s) => ({
		...s,
		start: segs[s.segmentIndices[0]].p0,
		end: segmentEnd(segs[s.segmentIndices[s.segmentIndices.length - 1]]),
		lengthMm: s.segmentIndices.reduce((t, i) => t + segmentLength(segs[i]), 0)
	}));
	const landmarks: Landmark[] = [];
	for (const l of base.landmarks) {
		if (l.kind === 'apex') {
			const a = target.apexes.find((x) => x.id === l.name);
			if (a) landmarks.push({ ...l, point: a.point });
			continue;
		}
		if (l.at) landmarks.push({ ...l, point: l.at.end ? segmentEnd(segs[l.at.segment]) : segs[l.at.segment].p0 });
	}
	for (const a of target.apexes) if (!landmarks.some((l) => l.name === a.id)) landmarks.push({ name: a.id, point: a.point, kind: 'apex' });
	return { piece: target, seams, landmarks };
}

export type AnchorResolution = { readonly ok: true; readonly point: Vec } | { readonly ok: false; readonly message: string };

const pct = (f: number) => `${(f * 100).toFixed(f * 100 === Math.round(f * 100) ? 0 : 1)} %`;
const mm = (v: number) => `${Math.abs(v).toFixed(1)} mm`;

/** An anchor in the trade's words: "30 % along the shoulder", "the bust-point", "12.0 mm below the side waist". */
export function anchorDescribe(a: Anchor): string {
	if (a.kind === 'landmark') return `the ${a.name}`;
	if (a.kind === 'edge') {
		const end = a.from === 'start' ? 'its start' : 'its end';
		return a.fraction !== undefined ? `${pct(a.from === 'start' ? a.fraction : 1 - a.fraction)} along the ${a.edge}` : `${mm(a.distanceMm!)} along the ${a.edge} from ${end}`;
	}
	const parts: string[] = [];
	if (Math.abs(a.dxMm) >= 0.05) parts.push(`${mm(a.dxMm)} ${a.dxMm > 0 ? 'outward (+x)' : 'inward (−x)'}`);
	if (Math.abs(a.dyMm) >= 0.05) parts.push(`${mm(a.dyMm)} ${a.dyMm > 0 ? 'below' : 'above'}`);
	return parts.length ? `${parts.join(' and ')} ${Math.abs(a.dxMm) >= 0.05 ? 'of' : ''} ${anchorDescribe(a.of)}`.replace('  ', ' ') : anchorDescribe(a.of);
}

/** Finds an anchor again on a body; says in the trade's words why it cannot be found. */
export function anchorResolve(body: AnchorBody, a: Anchor): AnchorResolution {
	const what = body.piece.name ? `the ${body.piece.name}` : 'the piece';
	if (a.kind === 'landmark') {
		const l = body.landmarks.find((x) => x.name === a.name);
		return l ? { ok: true, point: l.point } : { ok: false, message: `${what} has no ${a.name}` };
	}
	if (a.kind === 'edge') {
		const seam = body.seams.find((s) => s.name === a.edge);
		if (!seam) return { ok: false, message: `${what} has no ${a.edge}` };
		const distance = a.fraction !== undefined ? a.fraction * seam.lengthMm : a.distanceMm!;
		const r = seamPointAt(body.piece, seam, a.from, Math.min(distance, seam.lengthMm));
		if (a.distanceMm !== undefined && a.distanceMm > seam.lengthMm + 1e-9) {
			return { ok: false, message: `the ${a.edge} of ${what} is only ${seam.lengthMm.toFixed(1)} mm long, ${mm(a.distanceMm - seam.lengthMm)} short of ${anchorDescribe(a)}` };
		}
		return r.ok ? { ok: true, point: r.point } : { ok: false, message: r.message };
	}
	const base = anchorResolve(body, a.of);
	if (!base.ok) return base;
	return { ok: true, point: vecAdd(base.point, { x: a.dxMm, y: a.dyMm }) };
}

/** How far an anchor's point on a body lies from a given point (for tests and the editor's readout). */
export function anchorDistance(body: AnchorBody, a: Anchor, p: Vec): number {
	const r = anchorResolve(body, a);
	return r.ok ? vecDistance(r.point, p) : Infinity;
}
