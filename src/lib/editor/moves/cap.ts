import { dartApex, dartStart, deg, mm, pickDart, movePiece, stepPreview, type OnDart } from './common';
import { emptyPreview, NOTHING, outcome, type MoveDef } from './types';

export interface CapState extends OnDart {
	id: 'cap';
	/** The side the dart is pressed to. */
	pressToward: 'leg1' | 'leg2';
}

const step = (st: CapState) => (st.dartId ? { op: 'cap', params: { dartId: st.dartId, pressToward: st.pressToward } } : null);

/** Cap: true a dart's mouth for the side it is pressed to. */
export const capMove: MoveDef<CapState> = {
	id: 'cap',
	name: 'Cap',
	key: 'c',
	icon: 'M4 16 L12 9 L20 16 M4 16 L12 4 L20 16',
	edits: true,
	fresh: (ctx, prev) => ({ id: 'cap', ...(prev ? { pieceKey: prev.pieceKey, dartId: null } : dartStart(ctx)), pressToward: 'leg1' }),
	started: () => false,
	hint: (_ctx, st) => (st.dartId ? 'Choose the pressing side; Enter applies.' : 'Click the dart to true.'),
	down(ctx, st, p) {
		pickDart(ctx, st, p);
		return false;
	},
	commit(ctx, st) {
		const s = step(st);
		return s && st.pieceKey ? outcome(ctx.apply(st.pieceKey, s)) : NOTHING;
	},
	preview(ctx, st) {
		const piece = movePiece(ctx, st);
		if (!piece || !st.dartId) return null;
		if (!dartApex(piece, st.dartId)) return emptyPreview(st.pieceKey, 'That dart is not on this piece.');
		return stepPreview(ctx, st, step(st)!, [], (v) =>
			Object.entries(v).map(([k, x]) => ({ label: k.replace(/([A-Z])/g, ' $1').toLowerCase(), value: k.endsWith('Rad') ? deg(x) : mm(ctx.unit, x) }))
		);
	}
};
