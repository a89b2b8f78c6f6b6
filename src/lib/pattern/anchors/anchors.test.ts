import { describe, expect, it } from 'vitest';
import { blockDraft, EASE_DEFAULT } from '../drafting';
import { vecDistance } from '../kernel';
import { astmD5585MeasurementSet, measurementsMm } from '../measurements';
import { pieceSeams, seamLocate, seamPointAt } from '../piece-seams';
import { anchorBody, anchorBodyLike, anchorDescribe, anchorResolve, anchorSchema, type Anchor } from './anchor';
import { anchorInfer } from './anchor-infer';
import { pieceLandmarks } from './landmarks';
import { stepParamsCarry } from './step-anchors';

// Blocks drafted from ASTM D5585-11e1 Table 1 (misses, curvy) rows (reference-values row 1, C).
const front = (size: '6' | '10' | '14' | '16') => blockDraft(measurementsMm(astmD5585MeasurementSet('curvy', size)), EASE_DEFAULT, { bustDart: 'shoulder' }).front;

describe('landmarks of a drafted block', () => {
	it('names the apexes and the corners of the front block by the trade names of its seams', () => {
		const names = pieceLandmarks(front('10')).map((l) => l.name);
		expect(names).toContain('bust-point');
		expect(names).toContain('side neck point');
		expect(names).toContain('side waist');
		expect(names).toContain('centre front waist');
		expect(new Set(names).size).toBe(names.length);
	});

	it('gives sizes 6 to 14 of the chart the same landmark names', () => {
		const names = (p: ReturnType<typeof front>) => pieceLandmarks(p).map((l) => l.name).sort();
		expect(names(front('6'))).toEqual(names(front('10')));
		expect(names(front('14'))).toEqual(names(front('10')));
	});

	it('reads a much larger size with the base size’s names, seam by seam of the same segments', () => {
		// size 16's own proportions name its armhole a side seam; carried from size 10 it is the armhole
		expect(pieceLandmarks(front('16')).map((l) => l.name)).not.toContain('underarm');
		const like = anchorBodyLike(front('16'), anchorBody(front('10')));
		expect(like.seams.map((s) => s.name)).toEqual(anchorBody(front('10')).seams.map((s) => s.name));
		const underarm = anchorResolve(like, { kind: 'landmark', name: 'underarm' });
		const armhole = like.seams.find((s) => s.name === 'armhole')!;
		expect(underarm.ok && vecDistance(underarm.point, armhole.end)).toBe(0);
	});
});

describe('anchors found again', () => {
	it('reads a landmark, a seam place and an offset from absolute points, and finds each at the same point on the same body', () => {
		const body = anchorBody(front('10'));
		const bp = body.landmarks.find((l) => l.name === 'bust-point')!.point;
		const side = pieceSeams(body.piece).find((s) => s.name === 'side seam')!;
		const on = seamPointAt(body.piece, side, 'start', side.lengthMm / 3);
		const onSeam = on.ok ? on.point : bp;
		const inside = { x: bp.x - 20, y: bp.y + 35 };
		const kinds: string[] = [];
		for (const p of [bp, onSeam, inside]) {
			const a = anchorInfer(body, p)!;
			kinds.push(a.kind);
			expect(anchorSchema.safeParse(a).success).toBe(true);
			const r = anchorResolve(body, a);
			expect(r.ok && vecDistance(r.point, p)).toBeLessThan(1e-6);
		}
		expect(kinds).toEqual(['landmark', 'edge', 'offset']);
	});

	it('puts a landmark anchor on the larger block at that block’s own landmark', () => {
		const big = anchorBody(front('14'));
		const a: Anchor = { kind: 'landmark', name: 'side waist' };
		const r = anchorResolve(big, a);
		const want = big.landmarks.find((l) => l.name === 'side waist')!.point;
		expect(r.ok && vecDistance(r.point, want)).toBe(0);
		expect(vecDistance(want, anchorBody(front('10')).landmarks.find((l) => l.name === 'side waist')!.point)).toBeGreaterThan(5);
	});

	it('keeps a place along a seam at the same fraction of that seam on another size', () => {
		const small = anchorBody(front('6'));
		const seam = small.seams.find((s) => s.name === 'side seam')!;
		const r = anchorResolve(small, { kind: 'edge', edge: 'side seam', from: 'start', fraction: 0.5 });
		expect(r.ok).toBe(true);
		if (!r.ok) return;
		const loc = seamLocate(small.piece, small.seams, r.point)!;
		expect(small.seams[loc.seamIndex].name).toBe('side seam');
		expect(loc.fromStartMm).toBeCloseTo(seam.lengthMm / 2, 6);
	});

	it('measures a distance from either end of a seam and refuses one longer than the seam, in the trade’s words', () => {
		const body = anchorBody(front('10'));
		const seam = body.seams.find((s) => s.name === 'side seam')!;
		const fromEnd = anchorResolve(body, { kind: 'edge', edge: 'side seam', from: 'end', distanceMm: 0 });
		expect(fromEnd.ok && vecDistance(fromEnd.point, seam.end)).toBeLessThan(1e-9);
		const long = anchorResolve(body, { kind: 'edge', edge: 'side seam', from: 'start', distanceMm: seam.lengthMm + 40 });
		expect(long.ok).toBe(false);
		expect(!long.ok && long.message).toMatch(/side seam .* is only .* mm long/);
		const missing = anchorResolve(body, { kind: 'landmark', name: 'yoke point' });
		expect(!missing.ok && missing.message).toMatch(/has no yoke point/);
	});

	it('describes anchors as a pattern cutter says them', () => {
		expect(anchorDescribe({ kind: 'edge', edge: 'shoulder', from: 'start', fraction: 0.3 })).toBe('30 % along the shoulder');
		expect(anchorDescribe({ kind: 'offset', of: { kind: 'landmark', name: 'bust-point' }, dxMm: 0, dyMm: 32 })).toBe('32.0 mm below the bust-point');
	});

	it('refuses an edge anchor that gives both a fraction and a distance', () => {
		expect(anchorSchema.safeParse({ kind: 'edge', edge: 'shoulder', fraction: 0.2, distanceMm: 10 }).success).toBe(false);
	});
});

describe('step parameters carried to another size', () => {
	it('moves a point on the side seam of size 10 to the same place along the side seam of size 16', () => {
		const base = front('10');
		const target = front('16');
		const seam = pieceSeams(base).find((s) => s.name === 'side seam')!;
		const q = seamPointAt(base, seam, 'start', seam.lengthMm / 4);
		const at = q.ok ? q.point : seam.start;
		const r = stepParamsCarry({ id: 'n1', at }, [base], [target], false);
		expect(r.ok).toBe(true);
		if (!r.ok) return;
		const moved = (r.params as { at: { x: number; y: number } }).at;
		const like = anchorBodyLike(target, anchorBody(base));
		const loc = seamLocate(target, like.seams, moved)!;
		const tSeam = like.seams[loc.seamIndex];
		expect(tSeam.name).toBe('side seam');
		const baseLoc = seamLocate(base, pieceSeams(base), at)!;
		expect(loc.fromStartMm / tSeam.lengthMm).toBeCloseTo(baseLoc.fromStartMm / seam.lengthMm, 6);
		// and on the same size the point comes back where it was
		const same = stepParamsCarry({ id: 'n1', at }, [base], [base], false);
		expect(same.ok && vecDistance((same.params as { at: { x: number; y: number } }).at, at)).toBeLessThan(1e-6);
	});

	it('uses an anchor stored beside a point rather than reading one from the base body', () => {
		const base = front('10');
		const target = front('16');
		const r = stepParamsCarry({ at: { x: 0, y: 0, anchor: { kind: 'landmark', name: 'side neck point' } } }, [base], [target], false);
		const snp = pieceLandmarks(target).find((l) => l.name === 'side neck point')!.point;
		expect(r.ok && vecDistance((r.params as { at: { x: number; y: number } }).at, snp)).toBe(0);
	});

	it('says which point cannot be found again and why', () => {
		const base = front('10');
		const r = stepParamsCarry({ at: { x: 0, y: 0, anchor: { kind: 'edge', edge: 'yoke seam', fraction: 0.5 } } }, [base], [base], false);
		expect(r.ok).toBe(false);
		expect(!r.ok && r.message).toBe('50 % along the yoke seam: the Front block has no yoke seam'.replace('Front block', base.name));
	});
});
