import {
	outlineSignedArea,
	pointRotateAbout,
	segmentLength,
	segmentTangentAt,
	vecAngleBetween,
	type Outline,
	type Vec
} from './kernel';
import { apexById, pleatWedgeSegmentRange, wedgeGeometry, wedgeSegmentIndex } from './piece';
import type { Piece } from './piece-schema';

/** Turning above this angle between two seam stretches makes a corner (ends one seam, starts the next). */
export const SEAM_CORNER_ANGLE_RAD = (25 * Math.PI) / 180;

export interface WedgeMetrics {
	readonly id: string;
	readonly apexId: string;
	readonly angleRad: number;
	readonly intakeMm: number;
	readonly leg1LengthMm: number;
	readonly leg2LengthMm: number;
}

export interface DartMetrics extends WedgeMetrics {
	/** Angle and leg length of the sewn dart after pull back (else the block values). */
	readonly sewnAngleRad: number;
	readonly sewnLegLengthMm: number;
}

export interface PleatMetrics extends WedgeMetrics {
	readonly kind: 'pleat' | 'tuck';
	readonly depthMm: number;
}

export interface ApexTotal {
	readonly apexId: string;
	readonly label: string;
	readonly totalAngleRad: number;
	readonly dartCount: number;
	readonly pleatCount: number;
}

/** A seam stretch between two corners, measured with darts and pleats folded out. */
export interface SeamMetrics {
	readonly startPoint: Vec;
	readonly endPoint: Vec;
	readonly lengthMm: number;
	/** Outline segment indices that make it up, in order. */
	readonly segmentIndices: readonly number[];
}

export interface PieceMetrics {
	/** Area of the piece outside the dart and pleat wedges (they are cut out of the outline). */
	readonly areaMm2: number;
	readonly signedAreaMm2: number;
	readonly perimeterMm: number;
	readonly segmentLengthsMm: readonly number[];
	/** Perimeter without the wedge legs: the length of stitching line that is sewn to other pieces. */
	readonly seamLengthMm: number;
	readonly seams: readonly SeamMetrics[];
	readonly darts: readonly DartMetrics[];
	readonly pleats: readonly PleatMetrics[];
	readonly apexTotals: readonly ApexTotal[];
}

interface WedgeSpan {
	readonly first: number;
	readonly count: number;
	readonly apex: Vec;
	readonly closingRotationRad: number;
}

function wedgeSpans(piece: Piece): WedgeSpan[] {
	const spans: WedgeSpan[] = [];
	for (const d of piece.darts) {
		const apex = apexById(piece, d.apexId);
		if (!apex) continue;
		const i = wedgeSegmentIndex(piece.outline, apex.point, d.leg1End, d.leg2End);
		if (i < 0) continue;
		spans.push({ first: i, count: 2, apex: apex.point, closingRotationRad: wedgeGeometry(apex.point, d.leg1End, d.leg2End).closingRotationRad });
	}
	for (const p of piece.pleats) {
		const apex = apexById(piece, p.apexId);
		if (!apex) continue;
		const r = pleatWedgeSegmentRange(piece.outline, apex.point, p);
		if (!r) continue;
		spans.push({ ...r, apex: apex.point, closingRotationRad: wedgeGeometry(apex.point, p.leg1End, p.leg2End).closingRotationRad });
	}
	return spans;
}

/** Seams: stretches of outline between corners, with every wedge folded out (closed). */
export function outlineSeams(
	outline: Outline,
	spans: readonly { first: number; count: number; closingRotationRad: number }[],
	lengths: readonly number[],
	cornerAngleRad = SEAM_CORNER_ANGLE_RAD
): SeamMetrics[] {
	const n = outline.segments.length;
	const wedgeAt = new Array<number>(n).fill(-1);
	spans.forEach((s, k) => {
		for (let j = 0; j < s.count; j++) wedgeAt[(s.first + j) % n] = k;
	});
	// non-wedge segments in order, with the closing rotation accumulated from wedges just before each
	const items: { index: number; rotationBefore: number }[] = [];
	let pending = 0;
	for (let i = 0; i < n; i++) {
		const w = wedgeAt[i];
		if (w >= 0) {
			if (spans[w].first % n === i) pending += spans[w].closingRotationRad;
			continue;
		}
		items.push({ index: i, rotationBefore: pending });
		pending = 0;
	}
	if (items.length === 0) return [];
	// wedges at the very end wrap onto the first item
	items[0] = { index: items[0].index, rotationBefore: items[0].rotationBefore + pending };
	const isCorner = items.map((item, k) => {
		const prev = items[(k - 1 + items.length) % items.length];
		const tIn = segmentTangentAt(outline.segments[prev.index], 1);
		const tOut0 = segmentTangentAt(outline.segments[item.index], 0);
		const tOut = pointRotateAbout(tOut0, { x: 0, y: 0 }, item.rotationBefore);
		return Math.abs(vecAngleBetween(tIn, tOut)) > cornerAngleRad;
	});
	let start = isCorner.indexOf(true);
	const seams: SeamMetrics[] = [];
	if (start < 0) start = 0;
	let current: number[] = [];
	for (let k = 0; k < items.length; k++) {
		const kk = (start + k) % items.length;
		if (k > 0 && isCorner[kk]) {
			seams.push(seamOf(outline, current, lengths));
			current = [];
		}
		current.push(items[kk].index);
	}
	if (current.length) seams.push(seamOf(outline, current, lengths));
	return seams;
}

function seamOf(outline: Outline, indices: number[], lengths: readonly number[]): SeamMetrics {
	const first = outline.segments[indices[0]];
	const last = outline.segments[indices[indices.length - 1]];
	return {
		startPoint: first.p0,
		endPoint: last.kind === 'line' ? last.p1 : last.p3,
		lengthMm: indices.reduce((s, i) => s + lengths[i], 0),
		segmentIndices: indices
	};
}

/** Everything the ledger checks compare before and after an operation. */
export function pieceMetrics(piece: Piece): PieceMetrics {
	const segmentLengthsMm = piece.outline.segments.map((s) => segmentLength(s));
	const spans = wedgeSpans(piece);
	let legLength = 0;
	const n = piece.outline.segments.length;
	for (const s of spans) for (let j = 0; j < s.count; j++) legLength += segmentLengthsMm[(s.first + j) % n];
	const perimeterMm = segmentLengthsMm.reduce((t, l) => t + l, 0);
	const signedAreaMm2 = outlineSignedArea(piece.outline);
	const wedge = (id: string, apexId: string, leg1End: Vec, leg2End: Vec): WedgeMetrics | null => {
		const apex = apexById(piece, apexId);
		if (!apex) return null;
		const g = wedgeGeometry(apex.point, leg1End, leg2End);
		return { id, apexId, angleRad: g.angleRad, intakeMm: g.intakeMm, leg1LengthMm: g.leg1LengthMm, leg2LengthMm: g.leg2LengthMm };
	};
	const darts: DartMetrics[] = [];
	for (const d of piece.darts) {
		const w = wedge(d.id, d.apexId, d.leg1End, d.leg2End);
		if (!w) continue;
		darts.push({
			...w,
			sewnAngleRad: d.pullBack ? d.pullBack.sewnAngleRad : w.angleRad,
			sewnLegLengthMm: d.pullBack ? d.pullBack.sewnLegLengthMm : (w.leg1LengthMm + w.leg2LengthMm) / 2
		});
	}
	const pleats: PleatMetrics[] = [];
	for (const p of piece.pleats) {
		const w = wedge(p.id, p.apexId, p.leg1End, p.leg2End);
		if (w) pleats.push({ ...w, kind: p.kind, depthMm: w.intakeMm / 2 });
	}
	const apexTotals: ApexTotal[] = piece.apexes.map((a) => {
		const ds = darts.filter((d) => d.apexId === a.id);
		const ps = pleats.filter((p) => p.apexId === a.id);
		return {
			apexId: a.id,
			label: a.label,
			totalAngleRad: ds.reduce((s, d) => s + d.angleRad, 0) + ps.reduce((s, p) => s + p.angleRad, 0),
			dartCount: ds.length,
			pleatCount: ps.length
		};
	});
	return {
		areaMm2: Math.abs(signedAreaMm2),
		signedAreaMm2,
		perimeterMm,
		segmentLengthsMm,
		seamLengthMm: perimeterMm - legLength,
		seams: outlineSeams(piece.outline, spans, segmentLengthsMm),
		darts,
		pleats,
		apexTotals
	};
}
