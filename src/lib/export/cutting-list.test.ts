import { describe, expect, it } from 'vitest';
import { cuttingList, cuttingListCsv, grainText } from './cutting-list';
import { rectPiece } from './test-support/rect-piece';

const input = (piece: ReturnType<typeof rectPiece>, fabric: string) => ({ pieceId: piece.id, piece, fabric, versionNumber: 2, versionState: 'signed_off' });

describe('cutting list', () => {
	const list = cuttingList([
		input(rectPiece({ name: 'Side panel', w: 100, h: 200, cut: 'pair', allowanceMm: 15 }), 'coutil'),
		input(rectPiece({ name: 'Centre front', w: 80, h: 300, cut: 'on_fold', allowanceMm: 10 }), 'coutil'),
		input(rectPiece({ name: 'Facing', w: 50, h: 100, cut: 'single', grainDeg: 45 }), 'silk')
	]);

	it('gives each piece its quantity and its areas with and without allowance (a piece on the fold counts whole)', () => {
		const [side, front, facing] = list.rows;
		expect(side).toMatchObject({ quantity: 2, cutInstruction: 'cut 2, mirrored (a pair)' });
		expect(side.areaNetMm2).toBeCloseTo(100 * 200, 6);
		expect(side.areaCutMm2).toBeCloseTo(130 * 230, 6);
		expect(side.totalCutAreaMm2).toBeCloseTo(2 * 130 * 230, 6);
		expect(front).toMatchObject({ quantity: 1, cutInstruction: 'cut 1 on the fold' });
		expect(front.areaNetMm2).toBeCloseTo(2 * 80 * 300, 6);
		expect(front.areaCutMm2).toBeCloseTo(2 * 100 * 320, 6);
		// no allowance: the cut area is the net area
		expect(facing.areaCutMm2).toBeCloseTo(facing.areaNetMm2, 9);
	});

	it('totals the cloth and the pieces to cut per fabric', () => {
		expect(list.fabrics.map((f) => [f.fabric, f.pieceCount])).toEqual([
			['coutil', 3],
			['silk', 1]
		]);
		expect(list.fabrics[0].totalCutAreaMm2).toBeCloseTo(2 * 130 * 230 + 2 * 100 * 320, 6);
	});

	it('reads the grainline as straight, crosswise, bias or degrees off', () => {
		expect(grainText(rectPiece({ name: 'a', w: 100, h: 100, cut: 'single' }))).toBe('straight grain (lengthwise)');
		expect(grainText(rectPiece({ name: 'a', w: 100, h: 100, cut: 'single', grainDeg: 90 }))).toBe('crosswise grain');
		expect(grainText(rectPiece({ name: 'a', w: 100, h: 100, cut: 'single', grainDeg: -45 }))).toBe('bias (45°)');
		expect(grainText(rectPiece({ name: 'a', w: 100, h: 100, cut: 'single', grainDeg: 170 }))).toBe('10° off the lengthwise grain');
	});

	it('writes CSV in cm² with one total row per fabric, quoting commas and defusing formulas', () => {
		const csv = cuttingListCsv(cuttingList([input(rectPiece({ name: 'Yoke, upper', w: 100, h: 100, cut: 'single' }), '=HYPERLINK("x")')]));
		const lines = csv.trim().split('\r\n');
		expect(lines[0]).toBe('row,piece,fabric,cut,quantity,grain,area_net_cm2,area_cut_cm2,total_cut_cm2,version,state');
		expect(lines[1]).toBe(`piece,"Yoke, upper","'=HYPERLINK(""x"")",cut 1, right side up,1,straight grain (lengthwise),100,100,100,2,signed_off`.replace('cut 1, right side up', '"cut 1, right side up"'));
		expect(lines[2]).toBe(`fabric_total,,"'=HYPERLINK(""x"")",,1,,,,100,,`);
	});
});
