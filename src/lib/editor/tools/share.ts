import { vecDistance } from '$lib/geometry';
import { emptyPreview, type OverlayItem, type ToolDef } from './types';
import { dartApex, deg, mm, pickDart, stepPreview, toolPiece } from './common';

function equalise(fr: number[], keep: number): number[] {
	const n = fr.length;
	return n ? fr.map(() => (1 - keep) / n) : [];
}

/** Share: split a dart between several new points on the outline (fractions of its angle). */
export const shareTool: ToolDef = {
	id: 'share',
	name: 'Share',
	key: 'h',
	icon: 'M12 20 L4 8 M12 20 L9 4 M12 20 L15 4 M12 20 L20 8',
	edits: true,
	hint(s) {
		if (!s.input.dartId) return 'Click the dart to share out.';
		if (s.input.points.length === 0) return 'Click points on the outline where parts of the dart will open.';
		return 'Add more points, type the fractions, then Enter or Apply. Drag a point to move it.';
	},
	down(s, p) {
		if (!s.input.dartId || p.hit?.pieceKey !== s.input.pieceKey) return pickDart(s, p) && false;
		if (!(p.hit.kind === 'edge' || p.hit.kind === 'point')) return pickDart(s, p) && false;
		const i = s.input.points.findIndex((q) => vecDistance(q, p.hit!.local) < s.tolMm(10));
		if (i >= 0) {
			s.input.dragIndex = i;
			return true;
		}
		s.input.points = [...s.input.points, p.hit.local];
		s.input.fractions = equalise([...s.input.fractions, 0], s.input.keepFraction);
		s.input.dragIndex = s.input.points.length - 1;
		return true;
	},
	move(s, p) {
		if (s.input.dragIndex < 0 || !s.input.pieceKey) return;
		const snap = s.snapAt(p.world, { onlyPiece: s.input.pieceKey, outlineOnly: true });
		s.snapShown = snap;
		if (snap.local) s.input.points = s.input.points.map((q, i) => (i === s.input.dragIndex ? snap.local! : q));
	},
	up(s) {
		s.input.dragIndex = -1;
		s.snapShown = null;
	},
	commit(s) {
		const step = shareStep(s);
		if (step) s.commitStep(step);
	},
	preview(s) {
		const piece = toolPiece(s);
		if (!piece || !s.input.dartId) return null;
		const w = dartApex(piece, s.input.dartId);
		if (!w) return emptyPreview(s.input.pieceKey, 'That dart is not on this piece.');
		const overlay: OverlayItem[] = s.input.points.flatMap((q) => [
			{ kind: 'line' as const, points: [w.apex, q], tone: 'select' as const },
			{ kind: 'point' as const, at: q, tone: 'preview' as const }
		]);
		const step = shareStep(s);
		if (!step) return { ...emptyPreview(s.input.pieceKey), overlay };
		const sum = s.input.fractions.reduce((a, b) => a + b, 0) + s.input.keepFraction;
		return stepPreview(s, step, overlay, (v) => [
			...Object.entries(v)
				.filter(([k]) => k.endsWith('AngleRad') || k.endsWith('IntakeMm'))
				.map(([k, x]) => ({ label: k.replace(/([A-Z])/g, ' $1').replace('Rad', '').replace('Mm', '').toLowerCase(), value: k.endsWith('Rad') ? deg(x) : mm(s, x) })),
			{ label: 'Shares total', value: `${(sum * 100).toFixed(1)} %`, tone: Math.abs(sum - 1) < 1e-6 ? 'ok' : 'bad' }
		]);
	}
};

function shareStep(s: Parameters<NonNullable<ToolDef['commit']>>[0]) {
	if (!s.input.dartId || s.input.points.length === 0) return null;
	return {
		op: 'share',
		params: {
			dartId: s.input.dartId,
			parts: s.input.points.map((to, i) => ({ to, fraction: s.input.fractions[i] ?? 0 })),
			...(s.input.keepFraction > 0 ? { keep: { fraction: s.input.keepFraction } } : {})
		}
	};
}

export { equalise };
