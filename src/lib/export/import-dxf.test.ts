// DXF round trip: the export read back by the importer gives the same pieces, and bad files are refused.
import { describe, expect, it } from 'vitest';
import { outlineArea, pathLength } from '$lib/pattern/kernel';
import { outlinePleatsAcross } from '$lib/pattern/export/pleat-marks';
import { demoPrintPieces } from './test-support/demo-pieces';
import { rectPiece } from './test-support/rect-piece';
import { styleDxf } from './dxf-writer';
import { dxfImport } from './import-dxf';
import { importedPieces } from './import-model';
import { importRefusal } from './test-support/refusal';

const within = (got: number, want: number) => expect(Math.abs(got - want) / want).toBeLessThan(0.001);
const input = (piece: ReturnType<typeof rectPiece>) => ({ piece, styleName: 'S', sizeLabel: '10', quantity: piece.cut === 'pair' ? 2 : 1, category: piece.fabric });

const refusal = importRefusal;

describe('DXF import', () => {
	it('reads the demo style\'s export back as the same pieces (cut and net areas and perimeters within 0.1 %)', () => {
		const demo = demoPrintPieces();
		const pieces = importedPieces(dxfImport(styleDxf(demo.map(({ piece, meta }) => ({ piece, styleName: meta.styleName, sizeLabel: meta.sizeLabel, quantity: piece.cut === 'pair' ? 2 : 1, category: meta.fabric })))));
		expect(pieces.map((p) => p.name)).toEqual(demo.map((d) => d.piece.name));
		pieces.forEach((got, i) => {
			const want = demo[i].piece;
			const wantNet = outlinePleatsAcross(want);
			const wantCut = want.seamAllowance?.cutLine ?? wantNet;
			const gotCut = got.seamAllowance?.cutLine ?? got.outline;
			within(outlineArea(gotCut), outlineArea(wantCut));
			within(pathLength(gotCut), pathLength(wantCut));
			within(outlineArea(got.outline), outlineArea(wantNet));
			within(pathLength(got.outline), pathLength(wantNet));
			expect(got.cut).toBe(want.cut);
			expect(got.notches).toHaveLength(want.notches.length);
			expect(got.grainline === null).toBe(want.grainline === null);
			if (want.grainline) expect(got.grainline!.from.y).toBeCloseTo(want.grainline.from.y, 9);
		});
	});

	it('takes centimetres and inches from $INSUNITS', () => {
		const mm = styleDxf([input(rectPiece({ name: 'Square', w: 100, h: 100, cut: 'single' }))]);
		const cm = mm.replace(/\$INSUNITS\r?\n\s*70\r?\n\s*4/, (m) => m.replace(/4$/, '5'));
		expect(cm).not.toBe(mm);
		expect(outlineArea(importedPieces(dxfImport(cm))[0].outline)).toBeCloseTo(100 * 100 * 100, 3);
	});

	it('refuses a file without units, without a boundary, with an open or self-crossing boundary, naming the entity', () => {
		const ok = styleDxf([input(rectPiece({ name: 'Square', w: 100, h: 100, cut: 'single' }))]);
		expect(refusal(() => dxfImport(ok.replace(/\$INSUNITS\r?\n\s*70\r?\n\s*4/, (m) => m.replace(/4$/, '0')))).code).toBe('units_unknown');
		const none = refusal(() => dxfImport(ok.replace(/\r?\n8\r?\n1\r?\n/g, '\n8\n2\n')));
		expect([none.status, none.code]).toEqual([422, 'no_boundary']);
		// the boundary polyline's closed flag (code 70 = 1) taken off
		const open = refusal(() => dxfImport(ok.replace(/(LWPOLYLINE[\s\S]*?\n8\r?\n1\r?\n[\s\S]*?\n\s*70\r?\n\s*)1/, '$10')));
		expect(open.code).toBe('open_boundary');
		expect(open.message).toMatch(/LWPOLYLINE .*layer 1 in block "Square".*open/);
		const bow = styleDxf([input({ ...rectPiece({ name: 'Bow', w: 100, h: 100, cut: 'single' }), outline: { segments: [
			{ kind: 'line', p0: { x: 0, y: 0 }, p1: { x: 100, y: 100 } },
			{ kind: 'line', p0: { x: 100, y: 100 }, p1: { x: 100, y: 0 } },
			{ kind: 'line', p0: { x: 100, y: 0 }, p1: { x: 0, y: 100 } },
			{ kind: 'line', p0: { x: 0, y: 100 }, p1: { x: 0, y: 0 } }
		] } })]);
		const crossing = refusal(() => dxfImport(bow));
		expect(crossing.code).toBe('self_crossing_boundary');
		expect(crossing.message).toMatch(/block "Bow".*crosses itself/);
		expect(refusal(() => dxfImport('0\nSECTION\n2\nENTITIES\n0\nGARBAGE')).status).toBe(422);
	});
});
