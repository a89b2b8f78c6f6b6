// SVG round trip and refusals: the product's own SVG export read back, and unsafe or unreadable files.
import { describe, expect, it } from 'vitest';
import { outlineArea, pathLength } from '$lib/pattern/kernel';
import { outlinePleatsAcross } from '$lib/pattern/export/pleat-marks';
import { styleSvg } from '$lib/pattern/export/svg';
import { demoPrintPieces } from './test-support/demo-pieces';
import { importedPieces } from './import-model';
import { svgImport } from './import-svg';
import { importRefusal } from './test-support/refusal';

const within = (got: number, want: number) => expect(Math.abs(got - want) / want).toBeLessThan(0.001);

const refusal = importRefusal;

const square = (attrs: string, body = '<path d="M 0 0 H 100 V 100 H 0 Z"/>') => `<svg xmlns="http://www.w3.org/2000/svg" ${attrs}>${body}</svg>`;

describe('SVG import', () => {
	it('reads the demo style\'s SVG export back as the same pieces (areas and perimeters within 0.1 %)', () => {
		const demo = demoPrintPieces();
		const svg = styleSvg(demo.map(({ piece, meta }) => ({ piece, meta: { styleName: meta.styleName, styleCode: meta.styleCode, sizeLabel: meta.sizeLabel, versionNumber: meta.versionNumber } })));
		const pieces = importedPieces(svgImport(svg));
		expect(pieces.map((p) => p.name)).toEqual(demo.map((d) => d.piece.name));
		pieces.forEach((got, i) => {
			const want = demo[i].piece;
			const wantNet = outlinePleatsAcross(want);
			const wantCut = want.seamAllowance?.cutLine ?? wantNet;
			within(outlineArea(got.seamAllowance?.cutLine ?? got.outline), outlineArea(wantCut));
			within(pathLength(got.seamAllowance?.cutLine ?? got.outline), pathLength(wantCut));
			within(outlineArea(got.outline), outlineArea(wantNet));
			within(pathLength(got.outline), pathLength(wantNet));
			// a double notch is drawn as two marks
			expect(got.cut).toBe(want.cut);
			expect(got.notches).toHaveLength(want.notches.reduce((t, n) => t + n.count, 0));
			expect(got.grainline === null).toBe(want.grainline === null);
		});
	});

	it.each([
		['width="100mm" height="100mm" viewBox="0 0 100 100"', 100],
		['width="10cm" height="10cm" viewBox="0 0 1000 1000"', 10],
		['width="4in" height="4in" viewBox="0 0 100 100"', 101.6],
		['width="100px" height="100px"', (100 * 25.4) / 96]
	])('reads the side of a 100-unit square in %s as %f mm', (attrs, sideMm) => {
		const [p] = importedPieces(svgImport(square(attrs)));
		expect(outlineArea(p.outline)).toBeCloseTo(sideMm * sideMm, 6);
	});

	it('honours group and element transforms', () => {
		const [p] = importedPieces(svgImport(square('width="200mm" height="200mm" viewBox="0 0 200 200"', '<g transform="translate(50 50) scale(2)"><rect x="0" y="0" width="10" height="20" transform="rotate(30)"/></g>')));
		expect(outlineArea(p.outline)).toBeCloseTo(4 * 200, 6);
	});

	it('refuses what it cannot measure or must not read, saying why', () => {
		expect(refusal(() => svgImport(square('viewBox="0 0 100 100"'))).code).toBe('units_unknown');
		expect(refusal(() => svgImport(square('width="100%" height="100%" viewBox="0 0 100 100"'))).message).toMatch(/width "100%" is not a length/);
		const script = refusal(() => svgImport(square('width="1in" height="1in"', '<script>alert(1)</script><path d="M0 0 H10 V10 Z"/>')));
		expect([script.status, script.code]).toEqual([422, 'svg_script']);
		expect(refusal(() => svgImport(square('width="1in" height="1in" onload="x()"'))).code).toBe('svg_script');
		expect(refusal(() => svgImport(square('width="1in" height="1in"', '<image href="http://example.test/a.png"/>'))).code).toBe('svg_external');
		expect(refusal(() => svgImport(square('width="1in" height="1in"', '<use xlink:href="other.svg#a"/>'))).code).toBe('svg_external');
		expect(refusal(() => svgImport(square('width="1in" height="1in"', '<style>@import url(x.css);</style>'))).code).toBe('svg_external');
		expect(refusal(() => svgImport('<?xml version="1.0"?><!DOCTYPE svg [<!ENTITY x SYSTEM "file:///etc/passwd">]>' + square('width="1in" height="1in"'))).code).toBe('svg_external');
		expect(refusal(() => svgImport(square('width="1in" height="1in"', '<path d="M0 0 L10 0 L10 10"/>'))).code).toBe('no_boundary');
		const bow = refusal(() => svgImport(square('width="100mm" height="100mm"', '<path id="bow" d="M0 0 L100 100 L100 0 L0 100 Z"/>')));
		expect([bow.code, bow.message]).toEqual(['self_crossing_boundary', expect.stringMatching(/<path id="bow">.*crosses itself/)]);
		expect(refusal(() => svgImport('<html><body/></html>')).status).toBe(415);
	});
});
