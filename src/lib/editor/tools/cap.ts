import type { EditorState } from '../editor-state.svelte';
import { emptyPreview, type ToolDef } from './types';
import { dartApex, deg, mm, pickDart, stepPreview, toolPiece } from './common';

function step(s: EditorState) {
	return s.input.dartId ? { op: 'cap', params: { dartId: s.input.dartId, pressToward: s.input.pressToward } } : null;
}

/** Cap: true a dart's mouth for the side it is pressed to. */
export const capTool: ToolDef = {
	id: 'cap',
	name: 'Cap',
	key: 'c',
	icon: 'M4 16 L12 9 L20 16 M4 16 L12 4 L20 16',
	edits: true,
	hint: (s) => (s.input.dartId ? 'Choose the pressing side; Enter applies.' : 'Click the dart to true.'),
	down(s, p) {
		pickDart(s, p);
		return false;
	},
	commit(s) {
		const st = step(s);
		if (st) s.commitStep(st);
	},
	preview(s) {
		const piece = toolPiece(s);
		if (!piece || !s.input.dartId) return null;
		if (!dartApex(piece, s.input.dartId)) return emptyPreview(s.input.pieceKey, 'That dart is not on this piece.');
		return stepPreview(s, step(s)!, [], (v) =>
			Object.entries(v).map(([k, x]) => ({ label: k.replace(/([A-Z])/g, ' $1').toLowerCase(), value: k.endsWith('Rad') ? deg(x) : mm(s, x) }))
		);
	}
};
