import DxfParser from 'dxf-parser';
import type { Outline, Vec } from '$lib/pattern/kernel';
import { pathNearestPoint } from '$lib/pattern/kernel';
import { DXF_LAYERS } from './dxf-writer';
import { chainLoops, circlePoints, dxfArcPoints, DXF_CHAIN_GAP_MM, DXF_IMPORT_TOLERANCE_MM, polylinePoints, splinePoints, splineProblem, type Pt } from './dxf-curves';
import { boundaryChecked, ImportRefusal, polygonOutline, polylinePath, type ImportedNotch, type ImportedPiece } from './import-model';
import { NOTCH_SPACING_MM } from './marks';

/**
 * Reads a DXF in the pattern-exchange layout (ASTM D6673 layers as recalled, see dxf-writer.ts): each
 * block with a closed boundary on layer 1 is a piece (its sew line on 14, grain on 7, notches on 4,
 * internal lines on 8, drill holes on 13, annotation text on 15); closed boundaries on layer 1 outside
 * any block are pieces too. A boundary is a closed polyline (bulged spans read as arcs), a circle, a
 * closed spline, or lines, arcs, splines and open polylines that meet end to end; curves are flattened
 * within DXF_IMPORT_TOLERANCE_MM (dxf-curves.ts). Notches are points (a single notch each) or slits
 * (short lines from the cut edge inward; slits side by side along the seam are one double notch).
 * Units from $INSUNITS, else $MEASUREMENT; y is flipped to the product's y down.
 */

interface Entity {
	type: string;
	layer: string;
	handle?: number | string;
	vertices?: Pt[];
	shape?: boolean;
	text?: string;
	position?: Pt;
	center?: Pt;
	radius?: number;
	startAngle?: number;
	endAngle?: number;
	controlPoints?: Pt[];
	knotValues?: number[];
	degreeOfSplineCurve?: number;
	closed?: boolean;
	periodic?: boolean;
	rational?: boolean;
	name?: string;
}

/** Millimetres per drawing unit, by $INSUNITS code. */
const INSUNITS_MM: Record<number, number> = { 1: 25.4, 2: 304.8, 4: 1, 5: 10, 6: 1000 };

function unitScale(header: Record<string, unknown>): number {
	const ins = header.$INSUNITS;
	if (typeof ins === 'number' && INSUNITS_MM[ins]) return INSUNITS_MM[ins];
	const measurement = header.$MEASUREMENT;
	if (ins === undefined || ins === 0) {
		if (measurement === 1) return 1;
		if (measurement === 0) return 25.4;
	}
	throw new ImportRefusal(422, 'units_unknown', 'The file does not say its units ($INSUNITS or $MEASUREMENT): set them to millimetres, centimetres or inches.', 'HEADER');
}

const isPolyline = (e: Entity) => e.type === 'LWPOLYLINE' || e.type === 'POLYLINE';

function isClosed(e: Entity): boolean {
	if (e.shape) return true;
	const v = e.vertices ?? [];
	return v.length > 2 && Math.hypot(v[0].x - v[v.length - 1].x, v[0].y - v[v.length - 1].y) < 1e-6;
}

function describe(e: Entity, where: string): string {
	return `${e.type}${e.handle !== undefined ? ` (handle ${e.handle})` : ''} on layer ${e.layer} in ${where}`;
}

/** An entity's points in file units (tol in file units), and whether it is closed by itself. */
function entityPoints(e: Entity, tol: number, where: string): { points: Pt[]; closed: boolean } | null {
	if (isPolyline(e)) return { points: polylinePoints(e.vertices ?? [], isClosed(e), tol), closed: isClosed(e) };
	if (e.type === 'LINE' && e.vertices && e.vertices.length >= 2) return { points: e.vertices.slice(0, 2), closed: false };
	if (e.type === 'CIRCLE' && e.center && e.radius) return { points: circlePoints(e.center, e.radius, tol), closed: true };
	if (e.type === 'ARC' && e.center && e.radius) return { points: dxfArcPoints(e.center, e.radius, e.startAngle ?? 0, e.endAngle ?? 2 * Math.PI, tol), closed: false };
	if (e.type === 'SPLINE') {
		const s = { degree: e.degreeOfSplineCurve ?? 3, knots: e.knotValues ?? [], ctrl: e.controlPoints ?? [], rational: !!e.rational };
		const problem = splineProblem(s);
		if (problem) throw new ImportRefusal(422, 'unreadable_curve', `${describe(e, where)}: ${problem}.`, describe(e, where));
		const points = splinePoints(s.degree, s.knots, s.ctrl, tol);
		const ends = Math.hypot(points[0].x - points[points.length - 1].x, points[0].y - points[points.length - 1].y);
		return { points: ends <= tol ? points.slice(0, -1) : points, closed: !!e.closed || e.periodic === true || ends <= tol };
	}
	return null;
}

/** The closed loops drawn on a layer: closed entities and open ones chained end to end; an open end is refused. */
function layerLoops(entities: readonly Entity[], layer: string, where: string, s: number): { points: Pt[]; source: Entity }[] {
	const tol = DXF_IMPORT_TOLERANCE_MM / s;
	const loops: { points: Pt[]; source: Entity }[] = [];
	const parts: { points: Pt[]; source: Entity }[] = [];
	for (const e of entities) {
		if (e.layer !== layer) continue;
		const got = entityPoints(e, tol, where);
		if (!got) continue;
		(got.closed ? loops : parts).push({ points: got.points, source: e });
	}
	const chained = chainLoops(parts, DXF_CHAIN_GAP_MM / s);
	for (const o of chained.open) {
		const d = describe(o.source, where);
		throw new ImportRefusal(422, 'open_boundary', `${d}: the boundary is open (its ends do not meet; one ends at ${(o.end.x * s).toFixed(1)}, ${(o.end.y * s).toFixed(1)} mm).`, d);
	}
	return [...loops, ...chained.loops.map((l) => ({ points: l.points, source: l.sources[0] }))];
}

/** Notches on layer 4: points are single notches; slits (lines) side by side along the seam are one notch of their count. */
function notchesOf(entities: readonly Entity[], map: (p: Pt) => Vec, net: Outline, cut: Outline): ImportedNotch[] {
	const onLayer = entities.filter((e) => e.layer === DXF_LAYERS.notches);
	const out: ImportedNotch[] = onLayer
		.map((e) => (e.type === 'POINT' ? e.position : e.type === 'CIRCLE' ? e.center : undefined))
		.filter((p): p is Pt => !!p)
		.map((p) => ({ at: pathNearestPoint(net, map(p)).point, count: 1 }));
	// each slit's outer end: the end nearer the cut edge
	const slits = onLayer
		.filter((e) => (e.type === 'LINE' || isPolyline(e)) && (e.vertices?.length ?? 0) >= 2)
		.map((e) => {
			const [a, b] = [map(e.vertices![0]), map(e.vertices![e.vertices!.length - 1])];
			const da = pathNearestPoint(cut, a).distance;
			const db = pathNearestPoint(cut, b).distance;
			return da <= db ? a : b;
		});
	const taken = new Set<number>();
	slits.forEach((p, i) => {
		if (taken.has(i)) return;
		taken.add(i);
		const group = [p];
		slits.forEach((q, j) => {
			if (!taken.has(j) && group.length < 2 && Math.hypot(q.x - p.x, q.y - p.y) <= NOTCH_SPACING_MM * 1.5) {
				taken.add(j);
				group.push(q);
			}
		});
		const mid = { x: group.reduce((t, g) => t + g.x, 0) / group.length, y: group.reduce((t, g) => t + g.y, 0) / group.length };
		out.push({ at: pathNearestPoint(net, mid).point, count: group.length as 1 | 2 });
	});
	return out;
}

function pieceOf(entities: readonly Entity[], where: string, blockName: string, s: number): ImportedPiece[] {
	const map = (p: Pt): Vec => ({ x: p.x * s, y: -p.y * s });
	const boundaries = layerLoops(entities, DXF_LAYERS.boundary, where, s);
	if (boundaries.length === 0) return [];
	const texts = entities.filter((e) => e.layer === DXF_LAYERS.annotation && (e.type === 'TEXT' || e.type === 'MTEXT')).map((e) => e.text ?? '');
	const field = (key: string) => texts.map((t) => t.match(new RegExp(`^\\s*${key}\\s*:\\s*(.*)$`, 'i'))?.[1]?.trim()).find((v) => v);
	const quantity = Number(field('Quantity') ?? '1');
	const cutText = field('Cut');
	const cut = cutText === 'pair' || cutText === 'on_fold' || cutText === 'single' ? cutText : quantity === 2 ? 'pair' : 'single';
	const sew = boundaries.length === 1 ? layerLoops(entities, DXF_LAYERS.sewLine, where, s) : [];
	const grain = entities.find((e) => e.layer === DXF_LAYERS.grainLine && (e.type === 'LINE' || e.type === 'LWPOLYLINE'));
	const holes = entities
		.filter((e) => e.layer === DXF_LAYERS.drillHoles)
		.map((e) => (e.type === 'POINT' ? e.position : e.type === 'CIRCLE' ? e.center : e.vertices?.[0]))
		.filter((p): p is Pt => !!p)
		.map(map);
	const internal = entities
		.filter((e) => e.layer === DXF_LAYERS.internalLines)
		.map((e) => entityPoints(e, DXF_IMPORT_TOLERANCE_MM / s, where))
		.filter((g): g is { points: Pt[]; closed: boolean } => !!g && g.points.length >= 2)
		.map((g) => polylinePath((g.closed ? [...g.points, g.points[0]] : g.points).map(map)));
	return boundaries.map((b, i) => {
		const at = boundaries.length > 1 ? `${where}, boundary ${i + 1}` : where;
		const boundary = boundaryChecked(polygonOutline(b.points.map(map)), describe(b.source, where));
		const sewLine = sew.length === 1 ? boundaryChecked(polygonOutline(sew[0].points.map(map)), describe(sew[0].source, where)) : undefined;
		const net = sewLine ?? boundary;
		const gv = grain?.vertices;
		return {
			name: field('Piece Name') ?? blockName,
			source: at,
			boundary: boundary.outline,
			sewLine: sewLine?.outline,
			touchPoints: net.touchPoints,
			grainline: gv && gv.length >= 2 ? { from: map(gv[0]), to: map(gv[gv.length - 1]) } : undefined,
			notches: boundaries.length === 1 ? notchesOf(entities, map, net.outline, boundary.outline) : [],
			internalLines: boundaries.length === 1 ? internal : [],
			drillHoles: boundaries.length === 1 ? holes : [],
			cut,
			fabric: field('Category') ?? 'self'
		};
	});
}

export function dxfImport(text: string): ImportedPiece[] {
	let dxf;
	try {
		dxf = new DxfParser().parseSync(text);
	} catch (e) {
		throw new ImportRefusal(422, 'unreadable', `The DXF could not be read: ${(e as Error).message}`.slice(0, 300));
	}
	if (!dxf) throw new ImportRefusal(422, 'unreadable', 'The DXF could not be read.');
	const s = unitScale(dxf.header as Record<string, unknown>);
	const pieces: ImportedPiece[] = [];
	const blocks = (dxf.blocks ?? {}) as Record<string, { name: string; entities?: Entity[] }>;
	const model = (dxf.entities ?? []) as unknown as Entity[];
	// each block inserted in model space once (a block inserted twice is the same piece)
	const used = new Set<string>();
	for (const e of model) {
		if (e.type !== 'INSERT' || !e.name || used.has(e.name)) continue;
		used.add(e.name);
		const block = blocks[e.name];
		if (block?.entities) pieces.push(...pieceOf(block.entities as Entity[], `block "${e.name}"`, e.name, s));
	}
	pieces.push(...pieceOf(model.filter((e) => e.type !== 'INSERT'), 'model space', 'Imported piece', s));
	if (pieces.length === 0) throw new ImportRefusal(422, 'no_boundary', `No closed boundary on layer ${DXF_LAYERS.boundary} (the cut line of the pattern-exchange layout) was found.`);
	return pieces;
}
