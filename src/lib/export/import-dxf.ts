import DxfParser from 'dxf-parser';
import type { Vec } from '$lib/pattern/kernel';
import { DXF_LAYERS } from './dxf-writer';
import { boundaryChecked, ImportRefusal, polygonOutline, polylinePath, type ImportedPiece } from './import-model';

/**
 * Reads a DXF in the pattern-exchange layout (ASTM D6673 layers as recalled, see dxf-writer.ts): each
 * block with a closed boundary on layer 1 is a piece (its sew line on 14, grain on 7, notches on 4,
 * internal lines on 8, drill holes on 13, annotation text on 15); closed boundaries on layer 1 outside
 * any block are pieces too. Units from $INSUNITS, else $MEASUREMENT; y is flipped to the product's y down.
 */

type Pt = { x: number; y: number; bulge?: number };
interface Entity {
	type: string;
	layer: string;
	handle?: number | string;
	vertices?: Pt[];
	shape?: boolean;
	text?: string;
	position?: Pt;
	startPoint?: Pt;
	center?: Pt;
	radius?: number;
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

/** A polyline's points, with bulged (arc) spans flattened into short chords. */
function polylinePoints(vs: readonly Pt[], closed: boolean): Pt[] {
	const out: Pt[] = [];
	const n = vs.length;
	for (let i = 0; i < n; i++) {
		const a = vs[i];
		out.push(a);
		const b = vs[(i + 1) % n];
		if (!a.bulge || (!closed && i === n - 1)) continue;
		const theta = 4 * Math.atan(a.bulge);
		const chord = Math.hypot(b.x - a.x, b.y - a.y);
		const r = chord / (2 * Math.sin(theta / 2));
		const mid = { x: (a.x + b.x) / 2, y: (a.y + b.y) / 2 };
		const h = r * Math.cos(theta / 2);
		const nx = -(b.y - a.y) / chord;
		const ny = (b.x - a.x) / chord;
		const c = { x: mid.x + nx * h, y: mid.y + ny * h };
		const start = Math.atan2(a.y - c.y, a.x - c.x);
		const steps = Math.max(2, Math.ceil(Math.abs(theta) / (Math.PI / 32)));
		for (let k = 1; k < steps; k++) {
			const t = start + (theta * k) / steps;
			out.push({ x: c.x + Math.abs(r) * Math.cos(t), y: c.y + Math.abs(r) * Math.sin(t) });
		}
	}
	return out;
}

function isClosed(e: Entity): boolean {
	if (e.shape) return true;
	const v = e.vertices ?? [];
	return v.length > 2 && Math.hypot(v[0].x - v[v.length - 1].x, v[0].y - v[v.length - 1].y) < 1e-6;
}

function describe(e: Entity, where: string): string {
	return `${e.type}${e.handle !== undefined ? ` (handle ${e.handle})` : ''} on layer ${e.layer} in ${where}`;
}

function pieceOf(entities: readonly Entity[], where: string, blockName: string, s: number): ImportedPiece[] {
	const map = (p: Pt): Vec => ({ x: p.x * s, y: -p.y * s });
	const polys = (layer: string) => entities.filter((e) => e.layer === layer && (e.type === 'LWPOLYLINE' || e.type === 'POLYLINE'));
	const boundaries = polys(DXF_LAYERS.boundary);
	for (const b of boundaries) {
		if (!isClosed(b)) throw new ImportRefusal(422, 'open_boundary', `${describe(b, where)}: the boundary is open (its ends do not meet).`, describe(b, where));
	}
	if (boundaries.length === 0) return [];
	const texts = entities.filter((e) => e.layer === DXF_LAYERS.annotation && (e.type === 'TEXT' || e.type === 'MTEXT')).map((e) => e.text ?? '');
	const field = (key: string) => texts.map((t) => t.match(new RegExp(`^\\s*${key}\\s*:\\s*(.*)$`, 'i'))?.[1]?.trim()).find((v) => v);
	const quantity = Number(field('Quantity') ?? '1');
	const cutText = field('Cut');
	const cut = cutText === 'pair' || cutText === 'on_fold' || cutText === 'single' ? cutText : quantity === 2 ? 'pair' : 'single';
	const sew = polys(DXF_LAYERS.sewLine).filter(isClosed);
	const grain = entities.find((e) => e.layer === DXF_LAYERS.grainLine && (e.type === 'LINE' || e.type === 'LWPOLYLINE'));
	const points = (layer: string) =>
		entities
			.filter((e) => e.layer === layer)
			.map((e) => (e.type === 'POINT' ? e.position : e.type === 'CIRCLE' ? e.center : e.vertices?.[0]))
			.filter((p): p is Pt => !!p)
			.map(map);
	const internal = entities
		.filter((e) => e.layer === DXF_LAYERS.internalLines && (e.vertices?.length ?? 0) >= 2)
		.map((e) => polylinePath(polylinePoints(e.vertices!, isClosed(e)).map(map)));
	return boundaries.map((b, i) => {
		const at = boundaries.length > 1 ? `${where}, boundary ${i + 1}` : where;
		const boundary = boundaryChecked(polygonOutline(polylinePoints(b.vertices ?? [], true).map(map)), describe(b, where));
		const sewLine = boundaries.length === 1 && sew.length === 1 ? boundaryChecked(polygonOutline(polylinePoints(sew[0].vertices ?? [], true).map(map)), describe(sew[0], where)) : undefined;
		const net = sewLine ?? boundary;
		const gv = grain?.vertices;
		return {
			name: field('Piece Name') ?? blockName,
			source: at,
			boundary: boundary.outline,
			sewLine: sewLine?.outline,
			touchPoints: net.touchPoints,
			grainline: gv && gv.length >= 2 ? { from: map(gv[0]), to: map(gv[gv.length - 1]) } : undefined,
			notches: boundaries.length === 1 ? points(DXF_LAYERS.notches) : [],
			internalLines: boundaries.length === 1 ? internal : [],
			drillHoles: boundaries.length === 1 ? points(DXF_LAYERS.drillHoles) : [],
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
