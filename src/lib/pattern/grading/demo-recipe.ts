import { demoPath, type DemoPath } from '../fixtures/demo-path';
import { DRAFTED_SEAM_TOLERANCE_MM, draftedSeamPairs } from '../panels/drafted-seams';
import type { RecipePiece, StyleRecipe } from './style-recipe';

/**
 * The demo style (fixtures/demo-path.ts) as a size run reads a stored style: demo keys stand for piece
 * ids, `<key>:v<n>` for version ids, one style change `demo-change`. Pure, for tests and benchmarks.
 */
export function demoStyleRecipe(path: DemoPath = demoPath()): StyleRecipe {
	const changeId = 'demo-change';
	const pieces: RecipePiece[] = path.pieces.map((p) => {
		const origin = p.first.origin.op === 'change_result' ? { op: 'change_result', params: { ...(p.first.origin.params as object), changeId } } : p.first.origin;
		return {
			id: p.key,
			name: p.name,
			versions: [
				{ id: `${p.key}:v1`, number: 1, recipe: [origin], geometry: p.first.geometry },
				...p.later.map((v, i) => ({ id: `${p.key}:v${i + 2}`, number: i + 2, recipe: v.recipe, geometry: v.geometry }))
			]
		};
	});
	const sourceKeys = [...new Set(path.change.steps.flatMap((s) => s.sources.flatMap((src) => ('pieceId' in src ? [src.pieceId] : []))))];
	const keyOfPanel = new Map(path.pieces.map((p) => [p.first.geometry.id, p.key]));
	const seamPairs = draftedSeamPairs(path.draft).map((sp, i) => ({
		id: `demo-seam-${i + 1}`,
		label: sp.label,
		a: sp.a,
		b: sp.b,
		aPieceId: keyOfPanel.get(sp.aPanelId) ?? sp.aPanelId,
		bPieceId: keyOfPanel.get(sp.bPanelId) ?? sp.bPanelId,
		allowedEaseMm: 0,
		toleranceMm: DRAFTED_SEAM_TOLERANCE_MM
	}));
	return {
		pieces,
		changes: [{ id: changeId, bases: sourceKeys.map((k) => ({ pieceId: k, versionId: `${k}:v1` })), steps: path.change.steps }],
		seamPairs
	};
}
