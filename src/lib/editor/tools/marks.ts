import { outlineNearestPoint, vecDistance } from '$lib/geometry';
import { allowanceEdges } from '$lib/pattern/panels/allowance-edges';
import type { EditorState } from '../editor-state.svelte';
import { fmtArea, fmtDeg, fmtLength } from '../units';
import { type ToolDef } from './types';
import { mm, stepPreview, toolPiece } from './common';

/** Tools for the markings the sample room needs: notch, grainline, fold line, seam allowance. */

function uniqueId(taken: readonly string[], base: string): string {
	let n = taken.length + 1;
	while (taken.includes(`${base}-${n}`)) n++;
	return `${base}-${n}`;
}

function pickPiece(s: EditorState, key: string | undefined): boolean {
	if (!key) return false;
	const p = s.piece(key);
	if (!p || p.readOnly) return false;
	if (s.input.pieceKey !== key) {
		s.input.pieceKey = key;
		s.input.points = [];
		s.input.target = null;
	}
	s.selection.pieceKey = key;
	return true;
}

function reportReadouts(s: EditorState) {
	return (v: Readonly<Record<string, number>>) =>
		Object.entries(v).map(([k, x]) => {
			const words = k.replace(/([A-Z])/g, ' $1').replace(/ (Mm2|Mm|Rad|Deg)$/, '').toLowerCase();
			return {
				label: words.charAt(0).toUpperCase() + words.slice(1),
				value: k.endsWith('Mm2') ? fmtArea(x, s.unit) : k.endsWith('Mm') ? mm(s, x) : k.endsWith('Rad') ? fmtDeg(x) : Number.isInteger(x) ? String(x) : x.toFixed(2)
			};
		});
}

export function notchStep(s: EditorState) {
	const g = toolPiece(s);
	if (!g || !s.input.target) return null;
	return { op: 'notch', params: { id: uniqueId(g.notches.map((n) => n.id), 'notch'), at: s.input.target, count: s.input.count === 2 ? 2 : 1 } };
}

export const notchTool: ToolDef = {
	id: 'notch',
	name: 'Notch',
	key: 'n',
	icon: 'M3 6 L21 6 M12 6 L12 13 M9 18 L15 18',
	edits: true,
	hint: (s) => (s.input.target ? 'Enter or Apply places the notch; drag it along the outline to move it.' : 'Click the stitching line where the notch goes (one notch front, two back).'),
	down(s, p) {
		const h = p.hit;
		if (!h || !(h.kind === 'edge' || h.kind === 'point') || !pickPiece(s, h.pieceKey)) return false;
		s.input.target = h.local;
		return true;
	},
	move(s, p) {
		if (!s.input.pieceKey) return;
		const snap = s.snapAt(p.world, { onlyPiece: s.input.pieceKey, outlineOnly: true });
		s.snapShown = snap;
		if (snap.local) s.input.target = snap.local;
	},
	up: (s) => void (s.snapShown = null),
	commit(s) {
		const st = notchStep(s);
		if (st) s.commitStep(st);
	},
	preview(s) {
		const st = notchStep(s);
		if (!st || !s.input.target) return null;
		return stepPreview(s, st, [{ kind: 'point', at: s.input.target, tone: 'preview' }], reportReadouts(s));
	}
};

export function grainStep(s: EditorState) {
	if (!toolPiece(s) || !s.input.target) return null;
	return {
		op: 'grain',
		params: { through: s.input.target, lengthMm: s.input.spacingMm, direction: s.input.mode === 'equal_angle' ? 'lengthwise' : s.input.mode === 'equal_intake' ? 'crosswise' : 'bias', arrowheads: s.input.kind === 'tuck' ? 'one' : 'both' }
	};
}

export const grainTool: ToolDef = {
	id: 'grain',
	name: 'Grain',
	key: 'g',
	icon: 'M12 3 L12 21 M8 7 L12 3 L16 7 M8 17 L12 21 L16 17',
	edits: true,
	hint: (s) => (s.input.target ? 'Type the length and direction; Enter applies.' : 'Click inside a piece where the middle of the grainline goes.'),
	down(s, p) {
		const h = p.hit;
		if (!h || !pickPiece(s, h.pieceKey)) return false;
		s.input.target = s.local(h.pieceKey, p.world);
		return true;
	},
	move(s, p) {
		if (s.input.pieceKey) s.input.target = s.local(s.input.pieceKey, p.world);
	},
	commit(s) {
		const st = grainStep(s);
		if (st) s.commitStep(st);
	},
	preview(s) {
		const st = grainStep(s);
		if (!st || !s.input.target) return null;
		return stepPreview(s, st, [{ kind: 'point', at: s.input.target, tone: 'preview' }], reportReadouts(s));
	}
};

export const foldTool: ToolDef = {
	id: 'fold',
	name: 'Fold',
	key: 'f',
	icon: 'M6 3 L6 21 M10 5 L18 5 L18 19 L10 19 M6 8 L9 8 M6 12 L9 12 M6 16 L9 16',
	edits: true,
	hint: (s) => (s.input.points.length < 2 ? 'Click both ends of the straight edge that goes on the fold.' : 'Enter or Apply marks the fold.'),
	down(s, p) {
		const h = p.hit;
		if (!h || !(h.kind === 'edge' || h.kind === 'point') || !pickPiece(s, h.pieceKey)) return false;
		s.input.points = s.input.points.length >= 2 ? [h.local] : [...s.input.points, h.local];
		return false;
	},
	commit(s) {
		const [a, b] = s.input.points;
		if (a && b) s.commitStep({ op: 'fold', params: { from: a, to: b } });
	},
	preview(s) {
		const [a, b] = s.input.points;
		if (!toolPiece(s) || !a) return null;
		const overlay = [{ kind: 'point' as const, at: a, tone: 'preview' as const }, ...(b ? [{ kind: 'line' as const, points: [a, b], tone: 'preview' as const }] : [])];
		if (!b) return { pieceKey: s.input.pieceKey, piece: null, error: null, readouts: [], ledger: [], overlay, notes: [], canCommit: false };
		return stepPreview(s, { op: 'fold', params: { from: a, to: b } }, overlay, () => [{ label: 'Fold length', value: fmtLength(vecDistance(a, b), s.unit) }]);
	}
};

export function allowanceStep(s: EditorState) {
	if (!toolPiece(s)) return null;
	const widths: Record<string, number> = {};
	s.input.points.forEach((q, i) => {
		const w = s.input.fractions[i];
		if (w !== undefined) widths[String(q.x)] = w;
	});
	return { op: 'allowance', params: { defaultWidthMm: s.input.clearanceMm, widthsMm: widths, corners: { ...s.input.allowanceCorners }, defaultCorner: s.input.pressToward === 'leg1' ? 'mitre' : 'square' } };
}

export const allowanceTool: ToolDef = {
	id: 'allowance',
	name: 'Allowance',
	key: 'a',
	icon: 'M5 5 L19 5 L19 19 L5 19 Z M2 2 L22 2 L22 22 L2 22 Z',
	edits: true,
	hint: () => 'Type the seam allowance; click an edge to give it its own width, or a corner to shape it (folded as it will be pressed). Allowance comes last: Enter applies.',
	down(s, p) {
		const h = p.hit;
		if (!h || !pickPiece(s, h.pieceKey)) return false;
		const g = toolPiece(s);
		if (g && (h.kind === 'edge' || h.kind === 'point')) {
			const local = h.local;
			const edges = allowanceEdges(g);
			// a click on a corner (where one allowance edge ends and the next starts) picks that corner
			const corner = edges.findIndex((e) => vecDistance(e.path.segments[0].p0, local) <= s.tolMm(6));
			if (corner >= 0 && edges.length > 1) {
				if (!(corner in s.input.allowanceCorners)) s.input.allowanceCorners = { ...s.input.allowanceCorners, [corner]: 'folded_next' };
				return false;
			}
			let best = -1;
			let bestD = s.tolMm(10);
			for (const e of edges) {
				const d = outlineNearestPoint(e.path, local).distance;
				if (d <= bestD) {
					bestD = d;
					best = e.index;
				}
			}
			// edges with their own width: x holds the edge index, fractions the width
			if (best >= 0 && !s.input.points.some((q) => q.x === best)) {
				s.input.points = [...s.input.points, { x: best, y: 0 }];
				s.input.fractions = [...s.input.fractions, s.input.clearanceMm];
			}
		}
		return false;
	},
	commit(s) {
		const st = allowanceStep(s);
		if (st) s.commitStep(st);
	},
	preview(s) {
		const st = allowanceStep(s);
		if (!st) return null;
		return stepPreview(s, st, [], reportReadouts(s));
	}
};
