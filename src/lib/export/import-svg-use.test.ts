// SVG <use>: the referenced element of the same file is shown where the <use> puts it (its transform and
// x, y honoured); definitions are not drawn by themselves; external references and loops are refused.
import { describe, expect, it } from 'vitest';
import { outlineArea, pathBoundingBox } from '$lib/pattern/kernel';
import { svgImport } from './import-svg';
import { importedPieces } from './import-model';
import { importRefusal } from './test-support/refusal';

const svg = (body: string) =>
	`<svg xmlns="http://www.w3.org/2000/svg" xmlns:xlink="http://www.w3.org/1999/xlink" width="400mm" height="400mm" viewBox="0 0 400 400">${body}</svg>`;
const RECT = '<defs><path id="panel" d="M0 0 H100 V50 H0 Z"/></defs>';

const refusal = importRefusal;

describe('SVG <use>', () => {
	it('draws nothing from <defs> by itself', () => {
		expect(refusal(() => svgImport(svg(RECT))).code).toBe('no_boundary');
	});

	it('shows the referenced path at the use\'s x, y and transform', () => {
		const pieces = importedPieces(svgImport(svg(`${RECT}<use href="#panel" x="10" y="20" transform="translate(200 0) rotate(90)"/>`)));
		expect(pieces).toHaveLength(1);
		expect(outlineArea(pieces[0].outline)).toBeCloseTo(100 * 50, 6);
		// (x, y) → rotate 90° → translate: the rectangle [10, 110] × [20, 70] turned about the origin is
		// [-70, -20] × [10, 110], then moved 200 to the right
		const box = pathBoundingBox(pieces[0].outline);
		expect([box.minX, box.maxX, box.minY, box.maxY].map((v) => Math.round(v * 1e6) / 1e6)).toEqual([130, 180, 10, 110]);
	});

	it('makes one piece per use of the same definition, through xlink:href too, and inside groups with their own transform', () => {
		const pieces = svgImport(svg(`${RECT}<use href="#panel"/><g transform="scale(2)"><use xlink:href="#panel" y="100"/></g>`));
		expect(pieces.map((p) => Math.round(outlineArea(p.boundary)))).toEqual([5000, 20000]);
	});

	it('shows a <symbol>\'s content and a group of the product\'s own layers through a use', () => {
		const body =
			'<defs><symbol id="s"><g id="piece-1" data-name="Yoke"><g id="cut-line"><path d="M0 0 H80 V40 H0 Z"/></g><g id="notches"><circle cx="0" cy="20" r="1"/></g></g></symbol></defs>' +
			'<use href="#s" x="50" y="50"/>';
		const [p] = svgImport(svg(body));
		expect(p.name).toBe('Yoke');
		expect(p.notches.map((n) => [n.at.x, n.at.y])).toEqual([[50, 70]]);
	});

	it('refuses a use of another file, a use of nothing, and a use that shows itself', () => {
		const ext = refusal(() => svgImport(svg('<use href="other.svg#panel"/>')));
		expect([ext.status, ext.code]).toEqual([422, 'svg_external']);
		const missing = refusal(() => svgImport(svg('<use href="#nothing"/>')));
		expect([missing.status, missing.code]).toEqual([422, 'svg_use_missing']);
		const loop = refusal(() => svgImport(svg('<g id="a"><path d="M0 0 H10 V10 Z"/><use href="#a" x="20"/></g>')));
		expect([loop.status, loop.code]).toEqual([422, 'svg_use_loop']);
		expect(loop.message).toContain('<use href="#a">');
	});
});
