import { describe, expect, it } from 'vitest';
import { vecDistance, vecLerp } from '$lib/geometry';
import { frontBodiceBlock } from '$lib/pattern/fixtures/front-bodice-block';
import { pivot } from '$lib/pattern/operations';
import { dartSideLabels, seamEndLabel, seamsOf, seamTargetFrom, seamTargetOf, seamTargetPoint, seamTargetText } from './pivot-target';

/** The pivot form names the new opening as a place on a named seam, measured from one of its ends. */
describe('a pivot target as a point on a named seam', () => {
	const block = frontBodiceBlock();
	const seams = seamsOf(block);

	it('names the seams of a front bodice by where they run, the fold among them', () => {
		expect(seams.map((s) => s.name)).toEqual(['shoulder', 'armhole', 'side seam', 'waist', 'fold (centre front)', 'neckline']);
		expect(seams.find((s) => s.name.startsWith('fold'))!.onFold).toBe(true);
	});

	it('measures the shoulder across its dart, as sewn (the legs are not part of the seam)', () => {
		const shoulder = seams.find((s) => s.name === 'shoulder')!;
		const d = block.darts.find((x) => x.id === 'shoulder-dart')!;
		const sewn = vecDistance(shoulder.start, d.leg1End) + vecDistance(d.leg2End, shoulder.end);
		expect(shoulder.lengthMm).toBeCloseTo(sewn, 9);
		expect(seamEndLabel(shoulder, 'start')).toBe('from the neckline end');
		expect(seamEndLabel(shoulder, 'end')).toBe('from the armhole end');
	});

	it('gives one point for a seam, an end and a distance, and reads the same place back from either end', () => {
		const side = seams.find((s) => s.name === 'side seam')!;
		const r = seamTargetPoint(block, seams, { seamName: 'side seam', from: 'start', distanceMm: 60 });
		if (!r.ok) throw new Error(r.message);
		const back = seamTargetFrom(block, seams, r.point, 'end')!;
		expect(back.seamName).toBe('side seam');
		expect(back.distanceMm).toBeCloseTo(side.lengthMm - 60, 6);
		const again = seamTargetPoint(block, seams, back);
		if (!again.ok) throw new Error(again.message);
		expect(vecDistance(again.point, r.point)).toBeLessThan(1e-6);
	});

	it('never takes or shows a negative length: a point is read from its nearer end', () => {
		expect(seamTargetPoint(block, seams, { seamName: 'side seam', from: 'start', distanceMm: -5 }).ok).toBe(false);
		const side = seams.find((s) => s.name === 'side seam')!;
		const tooLong = seamTargetPoint(block, seams, { seamName: 'side seam', from: 'end', distanceMm: side.lengthMm + 1 });
		expect(tooLong.ok).toBe(false);
		for (const f of [0, 0.1, 0.5, 0.9, 1]) {
			const p = vecLerp(side.start, side.end, f);
			const t = seamTargetOf(block, seams, p)!;
			expect(t.distanceMm).toBeGreaterThanOrEqual(0);
			expect(t.distanceMm).toBeLessThanOrEqual(side.lengthMm / 2 + 1e-9);
		}
		expect(seamTargetText(block, seams, vecLerp(side.start, side.end, 0.25), (mm) => `${mm.toFixed(1)} mm`)).toMatch(/^side seam, \d+\.\d mm from the armhole end$/);
	});

	it('refuses the fold as a place to open, before the operation is asked', () => {
		const r = seamTargetPoint(block, seams, { seamName: 'fold (centre front)', from: 'start', distanceMm: 100 });
		expect(r.ok).toBe(false);
		if (!r.ok) expect(r.message).toMatch(/fold line/);
	});

	it('a point chosen this way is accepted by the pivot on the outline', () => {
		const r = seamTargetPoint(block, seams, { seamName: 'armhole', from: 'end', distanceMm: 40 });
		if (!r.ok) throw new Error(r.message);
		const moved = pivot(block, { dartId: 'shoulder-dart', to: r.point });
		expect(moved.ok).toBe(true);
	});
});

describe('the sides of a dart along its seam', () => {
	it('names them by the seam ends they face: the shoulder dart lies between the neckline and armhole ends', () => {
		const block = frontBodiceBlock();
		const d = block.darts.find((x) => x.id === 'shoulder-dart')!;
		expect(dartSideLabels(block, d)).toEqual({ leg1: 'toward the neckline end', leg2: 'toward the armhole end' });
	});
});
