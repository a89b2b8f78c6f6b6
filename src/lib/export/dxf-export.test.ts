// The DXF export read back with dxf-parser (a general-purpose DXF reader).
import { describe, expect, it } from 'vitest';
import DxfParser from 'dxf-parser';
import { outlineArea } from '$lib/pattern/kernel';
import { outlinePleatsAcross } from '$lib/pattern/export/pleat-marks';
import { demoPrintPieces } from './test-support/demo-pieces';
import { DXF_LAYERS, styleDxf } from './dxf-writer';

const pieces = demoPrintPieces().map(({ piece, meta }) => ({ piece, styleName: meta.styleName, sizeLabel: meta.sizeLabel, quantity: piece.cut === 'pair' ? 2 : 1, category: meta.fabric }));

type Entity = { type: string; layer: string; vertices?: { x: number; y: number }[]; shape?: boolean; text?: string };

function area(vs: { x: number; y: number }[]): number {
	let a = 0;
	for (let i = 0; i < vs.length; i++) a += vs[i].x * vs[(i + 1) % vs.length].y - vs[(i + 1) % vs.length].x * vs[i].y;
	return Math.abs(a) / 2;
}

describe('DXF export (pattern-exchange layout)', () => {
	const text = styleDxf(pieces);
	const parsed = new DxfParser().parseSync(text) as unknown as {
		header: Record<string, unknown>;
		tables: { layer: { layers: Record<string, unknown> } };
		blocks: Record<string, { name: string; entities?: Entity[] }>;
		entities: { type: string; name: string }[];
	};

	it('is in millimetres ($INSUNITS 4) and has the layers by number (ASTM D6673 as recalled, status M)', () => {
		expect(parsed.header.$INSUNITS).toBe(4);
		// 1 boundary, 14 sew line, 7 grain line, 4 notches, 8 internal lines, 13 drill holes, 15 annotation
		expect(Object.values(DXF_LAYERS).sort()).toEqual(['1', '13', '14', '15', '4', '7', '8']);
		for (const l of Object.values(DXF_LAYERS)) expect(Object.keys(parsed.tables.layer.layers)).toContain(l);
	});

	it('has one block per piece, inserted in model space, with its name, size, quantity and category as text', () => {
		const inserts = parsed.entities.filter((e) => e.type === 'INSERT');
		expect(inserts).toHaveLength(pieces.length);
		for (const [i, p] of pieces.entries()) {
			const block = parsed.blocks[inserts[i].name];
			expect(block, p.piece.name).toBeDefined();
			const texts = (block.entities ?? []).filter((e) => e.type === 'TEXT' && e.layer === '15').map((e) => e.text);
			expect(texts).toContain(`Piece Name: ${p.piece.name}`);
			expect(texts).toContain(`Size: ${p.sizeLabel}`);
			expect(texts).toContain(`Quantity: ${p.quantity}`);
			expect(texts).toContain(`Category: ${p.category}`);
		}
	});

	it('draws each boundary on layer 1 enclosing the piece\'s cut area within 0.1 %, with the sew line on 14 and the grain on 7', () => {
		const inserts = parsed.entities.filter((e) => e.type === 'INSERT');
		for (const [i, p] of pieces.entries()) {
			const entities = parsed.blocks[inserts[i].name].entities ?? [];
			const boundary = entities.filter((e) => e.type === 'LWPOLYLINE' && e.layer === '1');
			expect(boundary).toHaveLength(1);
			expect(boundary[0].shape).toBe(true);
			const want = outlineArea(p.piece.seamAllowance?.cutLine ?? outlinePleatsAcross(p.piece));
			expect(Math.abs(area(boundary[0].vertices!) - want) / want).toBeLessThan(0.001);
			if (p.piece.seamAllowance) {
				const sew = entities.filter((e) => e.type === 'LWPOLYLINE' && e.layer === '14');
				expect(Math.abs(area(sew[0].vertices!) - outlineArea(outlinePleatsAcross(p.piece))) / want).toBeLessThan(0.001);
			}
			if (p.piece.grainline) expect(entities.some((e) => e.type === 'LINE' && e.layer === '7')).toBe(true);
			// a slit per notch, two for a double notch
			expect(entities.filter((e) => e.type === 'LINE' && e.layer === '4')).toHaveLength(p.piece.notches.reduce((t, n) => t + n.count, 0));
		}
	});
});
