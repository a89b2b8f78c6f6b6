// Reads a PDF back for tests with pdfjs-dist (a general-purpose PDF reader, its Node build): page sizes,
// every stroked or filled path in page coordinates (points, y up) with its line width and dash, the clip
// in force, and the text. Curves are flattened finely (64 steps) for measuring.
import { getDocument, OPS } from 'pdfjs-dist/legacy/build/pdf.mjs';

type Matrix = [number, number, number, number, number, number];
export interface Pt {
	x: number;
	y: number;
}
export interface Box {
	minX: number;
	minY: number;
	maxX: number;
	maxY: number;
}
export interface ReadPath {
	/** Sub-paths, flattened, in page points. */
	subpaths: Pt[][];
	closed: boolean;
	filled: boolean;
	/** Line width in page points (scaled by the transform). */
	lineWidthPt: number;
	dashed: boolean;
	/** Clip in force when it was painted (page points), null if none. */
	clip: Box | null;
	/** Inside a form (the drawn sheet) or on the page itself. */
	inForm: boolean;
	box: Box;
}
export interface ReadPage {
	widthPt: number;
	heightPt: number;
	paths: ReadPath[];
	text: string[];
	/** Transform of each form drawn on the page. */
	forms: Matrix[];
}

const mul = (m: Matrix, n: Matrix): Matrix => [
	m[0] * n[0] + m[2] * n[1],
	m[1] * n[0] + m[3] * n[1],
	m[0] * n[2] + m[2] * n[3],
	m[1] * n[2] + m[3] * n[3],
	m[0] * n[4] + m[2] * n[5] + m[4],
	m[1] * n[4] + m[3] * n[5] + m[5]
];
const apply = (m: Matrix, x: number, y: number): Pt => ({ x: m[0] * x + m[2] * y + m[4], y: m[1] * x + m[3] * y + m[5] });

export function boxOf(points: Pt[]): Box {
	const b = { minX: Infinity, minY: Infinity, maxX: -Infinity, maxY: -Infinity };
	for (const p of points) {
		b.minX = Math.min(b.minX, p.x);
		b.minY = Math.min(b.minY, p.y);
		b.maxX = Math.max(b.maxX, p.x);
		b.maxY = Math.max(b.maxY, p.y);
	}
	return b;
}

export function polygonArea(points: Pt[]): number {
	let a = 0;
	for (let i = 0; i < points.length; i++) {
		const p = points[i];
		const q = points[(i + 1) % points.length];
		a += p.x * q.y - q.x * p.y;
	}
	return Math.abs(a) / 2;
}

interface State {
	ctm: Matrix;
	lineWidth: number;
	dashed: boolean;
	clip: Box | null;
	formDepth: number;
}

function pathPoints(ops: number[], args: number[], ctm: Matrix): { subpaths: Pt[][]; closed: boolean } {
	const subpaths: Pt[][] = [];
	let cur: Pt[] = [];
	let x = 0;
	let y = 0;
	let closed = false;
	let j = 0;
	const push = (px: number, py: number) => cur.push(apply(ctm, px, py));
	for (const op of ops) {
		if (op === OPS.moveTo) {
			if (cur.length) subpaths.push(cur);
			cur = [];
			x = args[j++];
			y = args[j++];
			push(x, y);
		} else if (op === OPS.lineTo) {
			x = args[j++];
			y = args[j++];
			push(x, y);
		} else if (op === OPS.curveTo || op === OPS.curveTo2 || op === OPS.curveTo3) {
			let c: number[];
			if (op === OPS.curveTo) c = args.slice(j, (j += 6));
			else if (op === OPS.curveTo2) c = [x, y, ...args.slice(j, (j += 4))];
			else {
				const a = args.slice(j, (j += 4));
				c = [a[0], a[1], a[2], a[3], a[2], a[3]];
			}
			const [x0, y0] = [x, y];
			for (let i = 1; i <= 64; i++) {
				const t = i / 64;
				const u = 1 - t;
				push(u * u * u * x0 + 3 * u * u * t * c[0] + 3 * u * t * t * c[2] + t * t * t * c[4], u * u * u * y0 + 3 * u * u * t * c[1] + 3 * u * t * t * c[3] + t * t * t * c[5]);
			}
			x = c[4];
			y = c[5];
		} else if (op === OPS.rectangle) {
			if (cur.length) subpaths.push(cur);
			const [rx, ry, w, h] = args.slice(j, (j += 4));
			cur = [apply(ctm, rx, ry), apply(ctm, rx + w, ry), apply(ctm, rx + w, ry + h), apply(ctm, rx, ry + h)];
			closed = true;
		} else if (op === OPS.closePath) closed = true;
	}
	if (cur.length) subpaths.push(cur);
	return { subpaths, closed };
}

export async function pdfRead(bytes: Uint8Array): Promise<ReadPage[]> {
	const doc = await getDocument({ data: new Uint8Array(bytes), verbosity: 0, isEvalSupported: false }).promise;
	const pages: ReadPage[] = [];
	for (let n = 1; n <= doc.numPages; n++) {
		const page = await doc.getPage(n);
		const [, , w, h] = page.view;
		const list = await page.getOperatorList();
		const paths: ReadPath[] = [];
		const forms: Matrix[] = [];
		let st: State = { ctm: [1, 0, 0, 1, 0, 0], lineWidth: 1, dashed: false, clip: null, formDepth: 0 };
		const stack: State[] = [];
		let pending: { subpaths: Pt[][]; closed: boolean } | null = null;
		let clipNext = false;
		const scale = (m: Matrix) => Math.sqrt(Math.abs(m[0] * m[3] - m[1] * m[2]));
		for (let i = 0; i < list.fnArray.length; i++) {
			const fn = list.fnArray[i];
			const a = list.argsArray[i] as unknown[];
			if (fn === OPS.save) stack.push({ ...st });
			else if (fn === OPS.restore) st = stack.pop() ?? st;
			else if (fn === OPS.transform) st.ctm = mul(st.ctm, a as Matrix);
			else if (fn === OPS.paintFormXObjectBegin) {
				stack.push({ ...st });
				if (a[0]) st.ctm = mul(st.ctm, a[0] as Matrix);
				st.formDepth++;
				forms.push(st.ctm);
			} else if (fn === OPS.paintFormXObjectEnd) st = stack.pop() ?? st;
			else if (fn === OPS.setLineWidth) st.lineWidth = a[0] as number;
			else if (fn === OPS.setDash) st.dashed = (a[0] as number[]).length > 0;
			else if (fn === OPS.constructPath) pending = pathPoints(a[0] as number[], a[1] as number[], st.ctm);
			else if (fn === OPS.clip || fn === OPS.eoClip) clipNext = true;
			else if (fn === OPS.endPath) {
				if (clipNext && pending) st.clip = boxOf(pending.subpaths.flat());
				clipNext = false;
				pending = null;
			} else if (pending && fn >= OPS.stroke && fn <= OPS.closeEOFillStroke) {
				const filled = fn !== OPS.stroke && fn !== OPS.closeStroke;
				paths.push({
					...pending,
					closed: pending.closed || fn === OPS.closeStroke,
					filled,
					lineWidthPt: st.lineWidth * scale(st.ctm),
					dashed: st.dashed,
					clip: st.clip,
					inForm: st.formDepth > 0,
					box: boxOf(pending.subpaths.flat())
				});
				pending = null;
			}
		}
		const text = (await page.getTextContent()).items.map((it) => ('str' in it ? it.str : ''));
		pages.push({ widthPt: w, heightPt: h, paths, text, forms });
	}
	return pages;
}
