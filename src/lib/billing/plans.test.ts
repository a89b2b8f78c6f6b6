import { describe, expect, it } from 'vitest';
import { limitCheck, limitsExceeded, planAllows, priceLabel, seatsReductionCheck, sizeRunCheck, SKETCH_LIMITS } from './plans';

const sketch = { plan: 'sketch' } as const;
const studio = (seatsPaid: number) => ({ plan: 'studio', seatsPaid }) as const;

describe('plan rules', () => {
	it('lets a Sketch studio reach its three seats and refuses the fourth, naming the limit and who can change it', () => {
		expect(limitCheck(sketch, 'seats', 2)).toEqual({ ok: true });
		const r = limitCheck(sketch, 'seats', 3);
		expect(r.ok).toBe(false);
		if (r.ok) return;
		expect(r).toMatchObject({ limit: 'seats', allowed: SKETCH_LIMITS.seats, used: 3 });
		expect(r.message).toContain('Sketch plan allows 3 seats');
		expect(r.message).toContain("studio's owner");
	});

	it('counts a Studio studio against the seats paid for and leaves styles open', () => {
		expect(limitCheck(studio(4), 'seats', 3).ok).toBe(true);
		const r = limitCheck(studio(4), 'seats', 4);
		expect(r.ok).toBe(false);
		if (!r.ok) expect(r.message).toContain('add seats');
		expect(limitCheck(studio(4), 'styles', 500).ok).toBe(true);
		expect(planAllows(studio(4), 'sizes_per_run')).toBeNull();
	});

	it('allows five styles on Sketch and refuses the sixth', () => {
		expect(limitCheck(sketch, 'styles', 4).ok).toBe(true);
		expect(limitCheck(sketch, 'styles', 5).ok).toBe(false);
	});

	it('allows size runs of up to three sizes on Sketch, any size on Studio', () => {
		expect(sizeRunCheck(sketch, 3).ok).toBe(true);
		const r = sizeRunCheck(sketch, 4);
		expect(r.ok).toBe(false);
		if (!r.ok) expect(r.message).toContain('3 sizes in a size run');
		expect(sizeRunCheck(studio(1), 12).ok).toBe(true);
	});

	it('refuses going down to fewer seats than members and pending invitations, saying what to do', () => {
		expect(seatsReductionCheck(4, { members: 3, invitations: 1 }).ok).toBe(true);
		const r = seatsReductionCheck(3, { members: 3, invitations: 1 });
		expect(r.ok).toBe(false);
		if (!r.ok) expect(r.message).toBe('4 seats are in use (3 members, 1 pending invitation): remove members or withdraw invitations before going down to 3 seats.');
	});

	it('lists the limits a lapsed studio is past, without touching what it has', () => {
		expect(limitsExceeded(sketch, { seats: 5, styles: 7 })).toEqual(['seats', 'styles']);
		expect(limitsExceeded(studio(6), { seats: 5, styles: 7 })).toEqual([]);
	});

	it('lets an owner have one studio on Sketch, any number on Studio', () => {
		expect(limitCheck(sketch, 'studios_owned', 0).ok).toBe(true);
		expect(limitCheck(sketch, 'studios_owned', 1).ok).toBe(false);
		expect(limitCheck(studio(3), 'studios_owned', 9).ok).toBe(true);
	});

	it('prices seats per interval', () => {
		expect(priceLabel('month', 5)).toBe('€75.00 a month');
		expect(priceLabel('year', 2)).toBe('€300.00 a year');
	});
});
