import { describe, expect, it } from 'vitest';
import { SVGPathData } from 'svg-pathdata';
import { outlineArea } from '../kernel';
import { frontBodiceBlock } from '../fixtures/front-bodice-block';
import { recipeStepApply } from '../recipe/registry';
import { pieceSvg, styleSvg } from './svg';

const meta = { styleName: 'Juniper bodice', styleCode: 'LR-101', sizeLabel: 'ASTM D5585 misses 8', versionNumber: 3 };

/** Area enclosed by SVG path data, read back by svg-pathdata (a general-purpose SVG path parser). */
function svgPathArea(d: string): number {
	const commands = new SVGPathData(d).toAbs().commands;
	const pts: { x: number; y: number }[] = [];
	let cur = { x: 0, y: 0 };
	for (const c of commands) {
		if (c.type === SVGPathData.MOVE_TO || c.type === SVGPathData.LINE_TO) {
			cur = { x: c.x, y: c.y };
			pts.push(cur);
		} else if (c.type === SVGPathData.CURVE_TO) {
			const p0 = cur;
			for (let i = 1; i <= 400; i++) {
				const t = i / 400;
				const u = 1 - t;
				pts.push({
					x: u * u * u * p0.x + 3 * u * u * t * c.x1 + 3 * u * t * t * c.x2 + t * t * t * c.x,
					y: u * u * u * p0.y + 3 * u * u * t * c.y1 + 3 * u * t * t * c.y2 + t * t * t * c.y
				});
			}
			cur = { x: c.x, y: c.y };
		}
	}
	let a = 0;
	for (let i = 0; i < pts.length; i++) {
		const p = pts[i];
		const q = pts[(i + 1) % pts.length];
		a += p.x * q.y - q.x * p.y;
	}
	return Math.abs(a) / 2;
}

function attr(svg: string, name: string): string {
	const m = new RegExp(`<svg[^>]* ${name}="([^"]+)"`).exec(svg);
	if (!m) throw new Error(`no ${name}`);
	return m[1];
}

describe('SVG export at true scale', () => {
	const piece = frontBodiceBlock();
	const svg = pieceSvg(piece, meta);

	it('gives width and height in mm and a viewBox of the same size (1 unit = 1 mm)', () => {
		const width = attr(svg, 'width');
		const height = attr(svg, 'height');
		expect(width).toMatch(/mm$/);
		expect(height).toMatch(/mm$/);
		const [, , vw, vh] = attr(svg, 'viewBox').split(' ').map(Number);
		expect(vw).toBeCloseTo(parseFloat(width), 6);
		expect(vh).toBeCloseTo(parseFloat(height), 6);
	});

	it("draws a cut line whose area equals the piece's area within 0.1 %", () => {
		const d = /<g id="cut-line"[^>]*><path d="([^"]+)"/.exec(svg)![1];
		const area = svgPathArea(d);
		expect(Math.abs(area - outlineArea(piece.outline)) / outlineArea(piece.outline)).toBeLessThan(0.001);
	});

	it('draws the cut line from the seam allowance when one was added, and says so', () => {
		const r = recipeStepApply(piece, { op: 'allowance', params: { defaultWidthMm: 10 } });
		if (!r.ok) throw new Error(r.error.message);
		const cutLine = r.piece.seamAllowance!.cutLine;
		const withAllowance = pieceSvg(r.piece, meta);
		const d = /<g id="cut-line"[^>]*><path d="([^"]+)"/.exec(withAllowance)![1];
		expect(Math.abs(svgPathArea(d) - outlineArea(cutLine)) / outlineArea(cutLine)).toBeLessThan(0.001);
		expect(outlineArea(cutLine)).toBeGreaterThan(outlineArea(piece.outline));
		expect(withAllowance).toContain('seam allowance included (10 mm');
		expect(svg).toContain('net pattern: no seam allowance');
	});

	it('has one group per layer and the labels a sample room needs', () => {
		for (const id of ['cut-line', 'stitching-line', 'darts-pleats', 'notches', 'labels', 'test-square']) {
			expect(svg).toContain(`id="${id}"`);
		}
		expect(svg).toContain('Juniper bodice · LR-101');
		expect(svg).toContain('version 3');
		expect(svg).toContain(piece.cut === 'pair' ? 'cut 2 (mirror)' : piece.cut === 'on_fold' ? 'cut 1 on fold' : 'cut 1, right side up');
	});

	it('labels single asymmetric pieces "cut 1, right side up" and pairs "cut 2 (mirror)"', () => {
		expect(pieceSvg({ ...piece, cut: 'single' }, meta)).toContain('cut 1, right side up');
		expect(pieceSvg({ ...piece, cut: 'pair' }, meta)).toContain('cut 2 (mirror)');
	});

	it('lays the pieces of a style side by side, each in its own group', () => {
		const sheet = styleSvg([
			{ piece: { ...piece, id: 'front' }, meta },
			{ piece: { ...piece, id: 'back', name: 'Back' }, meta }
		]);
		expect(sheet).toContain('id="piece-front"');
		expect(sheet).toContain('id="piece-back"');
		expect(attr(sheet, 'width')).toMatch(/mm$/);
	});
});
