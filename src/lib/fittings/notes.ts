/**
 * Fit notes as every page reads them: the categories with their names, the statuses, and which notes
 * show as pins on a version of their piece. Pure (shared by the server and the pages).
 */
export const FIT_NOTE_CATEGORY_LABELS = {
	too_tight: 'too tight',
	too_loose: 'too loose',
	length: 'length',
	balance: 'balance',
	seam_placement: 'seam placement',
	other: 'other'
} as const;
export type FitNoteCategory = keyof typeof FIT_NOTE_CATEGORY_LABELS;

export const FIT_NOTE_STATUS_LABELS = { open: 'open', in_hand: 'in hand', done: 'done' } as const;
export type FitNoteStatus = keyof typeof FIT_NOTE_STATUS_LABELS;

export interface PinnedNote {
	pieceId: string;
	versionNumber: number;
	status: FitNoteStatus;
	resolvedVersionNumber: number | null;
}

/**
 * A note shows on the version it was pinned on and on every later version of the piece until it is
 * done; a done note still shows on the versions before the one that resolved it.
 */
export function fitNoteShowsOn(note: PinnedNote, pieceId: string, versionNumber: number): boolean {
	if (note.pieceId !== pieceId || versionNumber < note.versionNumber) return false;
	if (note.status !== 'done') return true;
	return note.resolvedVersionNumber !== null && versionNumber < note.resolvedVersionNumber;
}

/** "done, resolved by version 5", "in hand", "open". */
export function fitNoteStatusText(note: Pick<PinnedNote, 'status' | 'resolvedVersionNumber'>): string {
	if (note.status === 'done') return note.resolvedVersionNumber !== null ? `done, resolved by version ${note.resolvedVersionNumber}` : 'done';
	return FIT_NOTE_STATUS_LABELS[note.status];
}
