import { describe, expect, it } from 'vitest';
import { fitNoteShowsOn, fitNoteStatusText } from './notes';

const note = (status: 'open' | 'in_hand' | 'done', resolved: number | null = null) => ({
	pieceId: 'band',
	versionNumber: 3,
	status,
	resolvedVersionNumber: resolved
});

describe('where a fit note shows as a pin', () => {
	it('shows an open note on its own version and every later one of the same piece, never before or on another piece', () => {
		expect([2, 3, 4, 9].map((v) => fitNoteShowsOn(note('open'), 'band', v))).toEqual([false, true, true, true]);
		expect(fitNoteShowsOn(note('in_hand'), 'band', 5)).toBe(true);
		expect(fitNoteShowsOn(note('open'), 'upper-front', 3)).toBe(false);
	});

	it('stops showing a done note from the version that resolved it on', () => {
		expect([3, 4, 5, 6].map((v) => fitNoteShowsOn(note('done', 5), 'band', v))).toEqual([true, true, false, false]);
	});

	it('says which version resolved a done note', () => {
		expect(fitNoteStatusText(note('done', 5))).toBe('done, resolved by version 5');
		expect(fitNoteStatusText(note('in_hand'))).toBe('in hand');
	});
});
