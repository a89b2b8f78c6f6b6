import type { Vec } from '$lib/pattern/kernel';
import { ImportRefusal } from './import-model';

/** Helpers of the SVG import: transforms, the layer a group names, and what makes a file unsafe. */

export type Matrix = [number, number, number, number, number, number];
export const IDENTITY: Matrix = [1, 0, 0, 1, 0, 0];

export function matrixMultiply(m: Matrix, n: Matrix): Matrix {
	return [
		m[0] * n[0] + m[2] * n[1],
		m[1] * n[0] + m[3] * n[1],
		m[0] * n[2] + m[2] * n[3],
		m[1] * n[2] + m[3] * n[3],
		m[0] * n[4] + m[2] * n[5] + m[4],
		m[1] * n[4] + m[3] * n[5] + m[5]
	];
}

export function matrixApply(m: Matrix, p: Vec): Vec {
	return { x: m[0] * p.x + m[2] * p.y + m[4], y: m[1] * p.x + m[3] * p.y + m[5] };
}

/** An SVG transform attribute (matrix, translate, scale, rotate, skewX, skewY) as one matrix. */
export function transformParse(s: string | undefined): Matrix {
	let m: Matrix = IDENTITY;
	if (!s) return m;
	for (const [, fn, args] of s.matchAll(/(matrix|translate|scale|rotate|skewX|skewY)\s*\(([^)]*)\)/g)) {
		const a = args.trim().split(/[\s,]+/).filter(Boolean).map(Number);
		const rad = ((a[0] ?? 0) * Math.PI) / 180;
		let t: Matrix = IDENTITY;
		if (fn === 'matrix' && a.length === 6) t = a as Matrix;
		else if (fn === 'translate') t = [1, 0, 0, 1, a[0] ?? 0, a[1] ?? 0];
		else if (fn === 'scale') t = [a[0] ?? 1, 0, 0, a[1] ?? a[0] ?? 1, 0, 0];
		else if (fn === 'rotate') {
			const r: Matrix = [Math.cos(rad), Math.sin(rad), -Math.sin(rad), Math.cos(rad), 0, 0];
			const [cx, cy] = [a[1] ?? 0, a[2] ?? 0];
			t = matrixMultiply(matrixMultiply([1, 0, 0, 1, cx, cy], r), [1, 0, 0, 1, -cx, -cy]);
		} else if (fn === 'skewX') t = [1, 0, Math.tan(rad), 1, 0, 0];
		else if (fn === 'skewY') t = [1, Math.tan(rad), 0, 1, 0, 0];
		m = matrixMultiply(m, t);
	}
	return m;
}

/** The layer a group's id or label names, as the product's own export names them. */
export function svgRole(label: string): 'boundary' | 'sew' | 'grain' | 'notches' | 'internal' | 'ignore' | 'none' | undefined {
	const l = label.toLowerCase();
	if (!l) return undefined;
	if (/^(cut-?line|boundary)$/.test(l)) return 'boundary';
	if (/^(stitching-?line|sew-?line)$/.test(l)) return 'sew';
	if (/^grain-?line$/.test(l)) return 'grain';
	if (/^notches$/.test(l)) return 'notches';
	if (/^(darts-pleats|fold-line|internal-lines)$/.test(l)) return 'internal';
	if (/^(test-square|labels)$/.test(l)) return 'ignore';
	return undefined;
}

const ACTIVE_ELEMENTS = new Set(['script', 'foreignobject', 'iframe', 'embed', 'object', 'handler', 'listener']);

function external(ref: string): boolean {
	return !ref.trim().startsWith('#');
}

/** Why a declaration, element or style sheet makes the file unsafe to read, or null. */
export function svgRefusalOf(o: { declaration?: string; element?: string; attrs?: Record<string, string>; css?: string }): ImportRefusal | null {
	const no = (code: string, message: string) => new ImportRefusal(422, code, message, o.element ? `<${o.element}>` : undefined);
	if (o.declaration !== undefined) {
		if (/^!doctype/i.test(o.declaration) && /<!entity|\bsystem\b|\bpublic\b/i.test(o.declaration))
			return no('svg_external', 'The SVG declares entities or an external document type; such files are refused.');
		if (/^\?xml-stylesheet/i.test(o.declaration)) return no('svg_external', 'The SVG links an external style sheet; such files are refused.');
		return null;
	}
	if (o.css !== undefined) {
		if (/@import|url\(\s*['"]?(?!#)/i.test(o.css)) return no('svg_external', 'The SVG\'s style sheet refers to something outside the file; such files are refused.');
		return null;
	}
	const name = o.element ?? '';
	if (ACTIVE_ELEMENTS.has(name)) return no('svg_script', `The SVG contains a <${name}> element (scripts and embedded documents are refused).`);
	for (const [k, v] of Object.entries(o.attrs ?? {})) {
		const key = k.toLowerCase();
		if (key.startsWith('on')) return no('svg_script', `The SVG has an event handler (${k} on <${name}>); scripts are refused.`);
		if ((key === 'href' || key === 'xlink:href' || key === 'src') && external(v))
			return no('svg_external', `The SVG refers to something outside the file (${k}="${v.slice(0, 80)}" on <${name}>); external references are refused.`);
		if (key === 'style' && /url\(\s*['"]?(?!#)|@import/i.test(v)) return no('svg_external', `The SVG's style on <${name}> refers to something outside the file; such files are refused.`);
	}
	return null;
}
