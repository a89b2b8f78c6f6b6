import { Parser } from 'htmlparser2';
import { SVGPathData, SVGShapes } from 'svg-pathdata';
import type { Outline, Path, Segment, Vec } from '$lib/pattern/kernel';
import { boundaryChecked, ImportRefusal, type ImportedNotch, type ImportedPiece } from './import-model';
import { svgRefusalOf, svgRole, transformParse, type Matrix, matrixMultiply, matrixApply } from './svg-read';

/**
 * Reads an SVG's outlines as pieces: paths (and polygons, polylines, rects) read with svg-pathdata in
 * the file's units (mm, cm, in, pt, pc, px at 96 per inch; the viewBox honoured). Groups named like the
 * product's own export ("cut-line", "stitching-line", "grainline", "notches", darts and internal lines)
 * are read as those layers, inside a group per piece ("piece-…"); in other files every closed path is a
 * piece's boundary. <use> shows the element it refers to within the file (its transform and x, y
 * honoured; content of <defs> and <symbol> is drawn only through a <use>). Scripts, event handlers and
 * references to anything outside the file are refused.
 */

interface Shape {
	readonly data: SVGPathData;
	readonly where: string;
	readonly role: ReturnType<typeof svgRole>;
	/** Index of the piece group it is in, or -1. */
	readonly group: number;
	readonly point?: Vec;
}

const MM_PER: Record<string, number> = { mm: 1, cm: 10, in: 25.4, pt: 25.4 / 72, pc: 25.4 / 6, px: 25.4 / 96, '': 25.4 / 96 };

function lengthMm(v: string | undefined, what: string): number {
	const m = v?.trim().match(/^([+-]?(?:\d+\.?\d*|\.\d+)(?:e[+-]?\d+)?)\s*(mm|cm|in|pt|pc|px)?$/i);
	if (!m || Number(m[1]) <= 0)
		throw new ImportRefusal(422, 'units_unknown', `The SVG's ${what} ${v === undefined ? 'is missing' : `"${v}" is not a length`}: the size on paper cannot be told. Give the root element a width and height in mm, cm, in or px.`, 'svg');
	return Number(m[1]) * MM_PER[(m[2] ?? '').toLowerCase()];
}

function rootMatrix(attrs: Record<string, string>): Matrix {
	const w = lengthMm(attrs.width, 'width');
	const h = lengthMm(attrs.height, 'height');
	const vb = attrs.viewBox?.trim().split(/[\s,]+/).map(Number);
	if (!vb) return [MM_PER.px, 0, 0, MM_PER.px, 0, 0];
	if (vb.length !== 4 || vb.some((n) => !Number.isFinite(n)) || vb[2] <= 0 || vb[3] <= 0)
		throw new ImportRefusal(422, 'units_unknown', `The SVG's viewBox "${attrs.viewBox}" is not four numbers with a positive width and height.`, 'svg');
	return [w / vb[2], 0, 0, h / vb[3], (-vb[0] * w) / vb[2], (-vb[1] * h) / vb[3]];
}

const num = (v: string | undefined) => Number(v ?? 0) || 0;
const coords = (v: string | undefined) => (v ?? '').trim().split(/[\s,]+/).filter(Boolean).map(Number);

function shapeData(name: string, a: Record<string, string>): SVGPathData | null {
	if (name === 'path') return a.d ? new SVGPathData(a.d) : null;
	if (name === 'polygon') return SVGShapes.createPolygon(coords(a.points));
	if (name === 'polyline') return SVGShapes.createPolyline(coords(a.points));
	if (name === 'rect') return SVGShapes.createRect(num(a.x), num(a.y), num(a.width), num(a.height));
	if (name === 'line') return SVGShapes.createPolyline([num(a.x1), num(a.y1), num(a.x2), num(a.y2)]);
	return null;
}

/** Sub-paths of path data (absolute, mm), as segments, each closed or open. */
function subpaths(data: SVGPathData): { segments: Segment[]; closed: boolean }[] {
	const out: { segments: Segment[]; closed: boolean }[] = [];
	let cur: Segment[] = [];
	let start: Vec = { x: 0, y: 0 };
	let at: Vec = { x: 0, y: 0 };
	const flush = (closed: boolean) => {
		if (cur.length) out.push({ segments: cur, closed });
		cur = [];
	};
	const far = (a: Vec, b: Vec) => Math.hypot(a.x - b.x, a.y - b.y) > 1e-6;
	for (const c of data.toAbs().normalizeST().qtToC().aToC().normalizeHVZ(false).commands) {
		if (c.type === SVGPathData.MOVE_TO) {
			flush(false);
			start = at = { x: c.x, y: c.y };
		} else if (c.type === SVGPathData.LINE_TO) {
			const p = { x: c.x, y: c.y };
			if (far(at, p)) cur.push({ kind: 'line', p0: at, p1: p });
			at = p;
		} else if (c.type === SVGPathData.CURVE_TO) {
			const p = { x: c.x, y: c.y };
			cur.push({ kind: 'cubic', p0: at, p1: { x: c.x1, y: c.y1 }, p2: { x: c.x2, y: c.y2 }, p3: p });
			at = p;
		} else if (c.type === SVGPathData.CLOSE_PATH) {
			if (far(at, start)) cur.push({ kind: 'line', p0: at, p1: start });
			flush(true);
			at = start;
		}
	}
	// an open sub-path whose ends meet is closed
	if (cur.length) flush(!far(at, start) && cur.length > 1);
	return out;
}

interface Node {
	readonly name: string;
	readonly attrs: Record<string, string>;
	readonly children: Node[];
}

/** Elements whose content is drawn only where a <use> shows it. */
const NOT_DRAWN = new Set(['defs', 'symbol', 'clippath', 'mask', 'pattern', 'marker', 'lineargradient', 'radialgradient']);
/** How deep <use> may nest (a deeper chain is taken for a loop). */
const USE_DEPTH_MAX = 16;

/** The file as a tree of elements; unsafe content refused as it is met. */
function svgTree(text: string): Node {
	const top: Node = { name: '#document', attrs: {}, children: [] };
	const stack: Node[] = [top];
	let refusal: ImportRefusal | null = null;
	let styleText = '';
	let inStyle = false;
	const parser = new Parser(
		{
			onprocessinginstruction(_name, data) {
				refusal ??= svgRefusalOf({ declaration: data });
			},
			onopentag(rawName, attrs) {
				const name = rawName.toLowerCase().replace(/^svg:/, '');
				refusal ??= svgRefusalOf({ element: name, attrs });
				inStyle = name === 'style';
				const node: Node = { name, attrs, children: [] };
				stack[stack.length - 1].children.push(node);
				stack.push(node);
			},
			ontext(t) {
				if (inStyle) styleText += t;
			},
			onclosetag(rawName) {
				const name = rawName.toLowerCase().replace(/^svg:/, '');
				if (name === 'style') {
					inStyle = false;
					refusal ??= svgRefusalOf({ css: styleText });
				}
				if (stack.length > 1) stack.pop();
			}
		},
		{ xmlMode: true, decodeEntities: true }
	);
	parser.write(text);
	parser.end();
	if (refusal) throw refusal;
	return top;
}

function idIndex(node: Node, index: Map<string, Node>): Map<string, Node> {
	if (node.attrs.id && !index.has(node.attrs.id)) index.set(node.attrs.id, node);
	for (const c of node.children) idIndex(c, index);
	return index;
}

export function svgImport(text: string): ImportedPiece[] {
	const svg = svgTree(text).children.find((n) => n.name !== '#text');
	if (!svg) throw new ImportRefusal(415, 'not_svg', 'The file is not an SVG: no <svg> element was found.');
	if (svg.name !== 'svg') throw new ImportRefusal(415, 'not_svg', 'The file is not an SVG: its root element is not <svg>.');
	const ids = idIndex(svg, new Map());
	const shapes: Shape[] = [];
	const groupNames: { name: string; cut: ImportedPiece['cut'] }[] = [];
	let count = 0;
	interface Ctx {
		matrix: Matrix;
		role: ReturnType<typeof svgRole>;
		group: number;
		/** The <use> elements this element is shown through, outermost first. */
		uses: string[];
	}
	const walk = (node: Node, parent: Ctx, shown = false) => {
		const { name, attrs } = node;
		if (NOT_DRAWN.has(name) && !shown) return;
		const matrix = matrixMultiply(parent.matrix, transformParse(attrs.transform));
		const label = attrs.id ?? attrs['inkscape:label'] ?? '';
		const role = svgRole(label) ?? parent.role;
		let group = parent.group;
		if (name === 'g' && /^piece-/.test(attrs.id ?? '')) {
			group = groupNames.length;
			const cut = attrs['data-cut'];
			groupNames.push({ name: attrs['data-name'] ?? attrs['inkscape:label'] ?? '', cut: cut === 'pair' || cut === 'on_fold' ? cut : 'single' });
		}
		const ctx: Ctx = { matrix, role, group, uses: parent.uses };
		if (name === 'use') {
			const ref = (attrs.href ?? attrs['xlink:href'] ?? '').trim();
			const target = ids.get(ref.slice(1));
			const where = `<use href="${ref.slice(0, 80)}">`;
			if (!target) throw new ImportRefusal(422, 'svg_use_missing', `${where} refers to no element of the file.`, where);
			if (parent.uses.length >= USE_DEPTH_MAX || parent.uses.includes(ref))
				throw new ImportRefusal(422, 'svg_use_loop', `${where} shows itself, directly or through other <use> elements; such files are refused.`, where);
			// the referenced element drawn at (x, y) in the use's own coordinates
			const at = matrixMultiply(matrix, [1, 0, 0, 1, num(attrs.x), num(attrs.y)]);
			walk(target, { ...ctx, matrix: at, uses: [...parent.uses, ref] }, true);
			return;
		}
		const via = ctx.uses.length ? ` via <use href="${ctx.uses[ctx.uses.length - 1]}">` : '';
		const where = `<${name}${attrs.id ? ` id="${attrs.id}"` : ''}> (shape ${count + 1})${via}`;
		if (name === 'circle' || name === 'ellipse') {
			count++;
			shapes.push({ data: new SVGPathData(''), where, role, group, point: matrixApply(matrix, { x: num(attrs.cx), y: num(attrs.cy) }) });
			return;
		}
		const data = shapeData(name, attrs);
		if (data) {
			count++;
			try {
				// horizontal and vertical lines made plain lines first: a turn would leave them neither
				shapes.push({ data: data.toAbs().normalizeHVZ(false).matrix(...matrix), where, role, group });
			} catch (e) {
				throw new ImportRefusal(422, 'bad_path', `${where}: the path data cannot be read (${(e as Error).message}).`, where);
			}
			return;
		}
		for (const c of node.children) walk(c, ctx);
	};
	let root: Matrix;
	try {
		root = matrixMultiply(rootMatrix(svg.attrs), transformParse(svg.attrs.transform));
	} catch (e) {
		throw e instanceof ImportRefusal ? e : new ImportRefusal(422, 'units_unknown', String(e));
	}
	for (const c of svg.children) walk(c, { matrix: root, role: 'none', group: -1, uses: [] });
	return piecesFromShapes(shapes, groupNames);
}

function piecesFromShapes(shapes: readonly Shape[], groupNames: readonly { name: string; cut: ImportedPiece['cut'] }[]): ImportedPiece[] {
	const layered = shapes.some((s) => s.role === 'boundary');
	const pieces: ImportedPiece[] = [];
	const blank = { notches: [] as ImportedNotch[], internalLines: [] as Path[], drillHoles: [] as Vec[], fabric: 'self' };
	for (const s of shapes) {
		if (s.point || !(layered ? s.role === 'boundary' : s.role === 'none')) continue;
		for (const sp of subpaths(s.data)) {
			if (!sp.closed) {
				if (layered) throw new ImportRefusal(422, 'open_boundary', `${s.where}: the boundary is open (its ends do not meet).`, s.where);
				continue;
			}
			const { outline, touchPoints } = boundaryChecked({ segments: sp.segments }, s.where);
			const inGroup = (x: Shape) => s.group >= 0 && x.group === s.group;
			let sewLine: Outline | undefined;
			let net = touchPoints;
			const sew = shapes.filter((x) => inGroup(x) && x.role === 'sew').flatMap((x) => subpaths(x.data).filter((q) => q.closed).map((q) => ({ q, where: x.where })));
			if (sew.length === 1) {
				const checked = boundaryChecked({ segments: sew[0].q.segments }, sew[0].where);
				sewLine = checked.outline;
				net = checked.touchPoints;
			}
			const grain = shapes.find((x) => inGroup(x) && x.role === 'grain' && !x.point && subpaths(x.data)[0]?.segments.length === 1);
			const g = grain && subpaths(grain.data)[0].segments[0];
			pieces.push({
				...blank,
				name: (s.group >= 0 ? groupNames[s.group].name : '') || `Imported piece ${pieces.length + 1}`,
				cut: s.group >= 0 ? groupNames[s.group].cut : 'single',
				source: s.where,
				boundary: outline,
				sewLine,
				touchPoints: net,
				grainline: g ? { from: g.p0, to: g.kind === 'line' ? g.p1 : g.p3 } : undefined,
				notches: shapes.filter((x) => inGroup(x) && x.role === 'notches' && x.point).map((x) => ({ at: x.point!, count: 1 as const })),
				internalLines: shapes.filter((x) => inGroup(x) && x.role === 'internal').flatMap((x) => subpaths(x.data).map((q) => ({ segments: q.segments })))
			});
		}
	}
	if (pieces.length === 0) throw new ImportRefusal(422, 'no_boundary', 'No closed outline was found in the SVG (a path, polygon or rect whose ends meet).');
	return pieces;
}
