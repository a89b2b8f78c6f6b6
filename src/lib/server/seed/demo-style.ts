import { DEMO_CHART, DEMO_STYLE, demoPath } from '$lib/pattern/fixtures/demo-path';
import { DRAFTED_SEAM_TOLERANCE_MM, draftedSeamPairs } from '$lib/pattern/panels/drafted-seams';
import type { Db } from '../db';
import type { Role } from '../db/schema';
import { measurementChartsEnsure } from '../measurements/charts';
import { draftedStyleDiscard, measurementSetsOfStudio } from '../repositories/measurement-sets';
import { seamPairsCreate } from '../repositories/seam-pairs';
import { stylesCreate, stylesOfStudio } from '../repositories/styles';
import { changeSave } from '../changes/save';
import { pieceCreateWithFirstVersion } from '../versions/piece-create';
import { versionSave, type SaveOutcome } from '../versions/save';
import { versionStateChange } from '../versions/state';
import { demoStyleMarkingsRefresh } from './demo-style-markings';

export interface DemoStyleAuthors {
	/** Drafts and saves every version. */
	patterncutter: string;
	/** Signs the final versions off. */
	designer: string;
}

export interface DemoStyleSeedResult {
	styleId: string;
	created: boolean;
	pieces: { id: string; name: string; versions: { id: string; number: number }[] }[];
}

/** Pieces whose last version goes to the sample room (proposed by the cutter, signed off by the designer). */
const SIGNED_OFF = ['midriff-band', 'upper-front'];

function refusal(what: string, r: Extract<SaveOutcome, { ok: false }>): Error {
	return new Error(`Demo style: ${what} was refused: ${'problem' in r ? r.problem.message : r.message}`);
}

/**
 * Seeds the demo style "Juniper corset bodice" (LR-214) into the demo studio: every piece and version of
 * the pure demo path ($lib/pattern/fixtures/demo-path.ts), stored through the same server functions as
 * the API, so each version is verified on the server (its recipe replayed on the previous version, the
 * shaping checks run) before it is stored; the band and the upper front come from one style change,
 * recomputed by the server from the drafted panels (the change endpoint's own path). Idempotent: when the studio already has a
 * style with this code, only the markings added since it was seeded are filled in (demo-style-markings.ts). All or nothing: if any version is refused, the new style is removed again.
 * Takes `db` (not a transaction): versionSave opens its own transactions.
 */
export async function demoStyleSeed(db: Db, studioId: string, authors: DemoStyleAuthors): Promise<DemoStyleSeedResult> {
	const existing = (await stylesOfStudio(db, studioId)).find((s) => s.code === DEMO_STYLE.code);
	if (existing) {
		// seeded by an earlier version: the markings added since (pressing directions, centre mark) are filled in
		await demoStyleMarkingsRefresh(db, existing.id);
		return { styleId: existing.id, created: false, pieces: [] };
	}

	await measurementChartsEnsure(db, studioId);
	const set = (await measurementSetsOfStudio(db, studioId)).find((s) => s.chartKey === DEMO_CHART.chartKey);
	if (!set) throw new Error(`Demo style: the studio has no chart set "${DEMO_CHART.chartKey}".`);

	const path = demoPath();
	const style = await stylesCreate(db, {
		studioId,
		name: DEMO_STYLE.name,
		code: DEMO_STYLE.code,
		season: DEMO_STYLE.season,
		notes: DEMO_STYLE.notes,
		measurementSetId: set.id,
		createdBy: authors.patterncutter
	});
	const made = new Map<string, { id: string; name: string; versions: { id: string; number: number }[] }>();
	const fromChange = new Set(Object.keys(path.change.results));
	const laterVersions = async (p: (typeof path.pieces)[number], pieceId: string, versions: { id: string; number: number }[]) => {
		for (const v of p.later) {
			const r = await versionSave(db, { studioId, pieceId, baseVersionId: versions[versions.length - 1].id, message: v.message, geometry: v.geometry, recipe: v.recipe, authorId: authors.patterncutter });
			if (!r.ok) throw refusal(`${p.name} v${versions.length + 1}`, r);
			versions.push({ id: r.version.id, number: r.version.number });
		}
		made.set(p.key, { id: pieceId, name: p.name, versions });
	};
	try {
		// the drafted pieces, each verified and stored as version 1
		for (const p of path.pieces.filter((q) => !fromChange.has(q.key))) {
			const origin = { op: 'draft', params: { measurementSetId: set.id, ...(p.first.origin.params as object) } };
			const first = await pieceCreateWithFirstVersion(db, { studioId, styleId: style.id, authorId: authors.patterncutter, name: p.name, message: p.first.message, geometry: p.first.geometry, origin });
			if (!first.ok) throw refusal(`${p.name} v1`, first);
			await laterVersions(p, first.piece.id, [{ id: first.version.id, number: first.version.number }]);
		}
		// the seams between neighbouring under-structure panels, stored as drafting a style stores them
		const pieceOfPanel = new Map(path.pieces.map((p) => [p.first.geometry.id, made.get(p.key)?.id]));
		for (const sp of draftedSeamPairs(path.draft)) {
			const aPieceId = pieceOfPanel.get(sp.aPanelId);
			const bPieceId = pieceOfPanel.get(sp.bPanelId);
			if (!aPieceId || !bPieceId) throw new Error(`Demo style: ${sp.label} names a panel that was not stored.`);
			await seamPairsCreate(db, { styleId: style.id, label: sp.label, aPieceId, aEdge: sp.a, bPieceId, bEdge: sp.b, allowedEaseMm: 0, toleranceMm: DRAFTED_SEAM_TOLERANCE_MM });
		}
		// the carry and the joins above the line: one style change, recomputed by the server from the panels
		const idOf = (key: string) => made.get(key)?.id ?? key;
		const sourceKeys = [...new Set(path.change.steps.flatMap((s) => s.sources.flatMap((src) => ('pieceId' in src ? [src.pieceId] : []))))];
		const newKeys = Object.keys(path.change.results);
		const change = await changeSave(db, {
			studioId,
			styleId: style.id,
			authorId: authors.patterncutter,
			body: {
				message: path.change.message,
				bases: sourceKeys.map((k) => ({ pieceId: idOf(k), versionId: made.get(k)!.versions[0].id })),
				steps: path.change.steps.map((s) => ({ ...s, sources: s.sources.map((src) => ('pieceId' in src ? { ...src, pieceId: idOf(src.pieceId) } : src)) })),
				pieces: newKeys.map((k) => {
					const p = path.pieces.find((q) => q.key === k)!;
					return { ...path.change.results[k], name: p.name, cut: p.first.geometry.cut, geometry: p.first.geometry };
				}),
				seamPairs: { create: [], update: [] }
			}
		});
		if (!change.ok) throw new Error(`Demo style: the carry was refused: ${change.status === 409 ? 'a base moved' : change.status === 404 ? change.message : change.problem.message}`);
		for (const [i, k] of newKeys.entries()) {
			const p = path.pieces.find((q) => q.key === k)!;
			await laterVersions(p, change.pieces[i].id, [...change.pieces[i].versions]);
		}
		for (const key of SIGNED_OFF) {
			const p = made.get(key)!;
			const last = p.versions[p.versions.length - 1];
			// proposed by the cutter, then signed off by the designer after reviewing it (no e-mails: origin null)
			const steps: { action: Parameters<typeof versionStateChange>[1]['action']; user: { id: string; name: string }; role: Role }[] = [
				{ action: { action: 'propose', comment: '' }, user: { id: authors.patterncutter, name: 'pattern cutter' }, role: 'patterncutter' },
				{ action: { action: 'sign_off', comment: 'Ready for the sample room.', acknowledged: [] }, user: { id: authors.designer, name: 'designer' }, role: 'designer' }
			];
			for (const s of steps) {
				const r = await versionStateChange(db, { studioId, pieceId: p.id, versionId: last.id, origin: null, ...s });
				if (!r.ok) throw new Error(`Demo style: ${p.name} v${last.number} could not be ${s.action.action.replace('_', ' ')}: ${r.message}`);
			}
		}
	} catch (e) {
		await draftedStyleDiscard(db, studioId, style.id);
		throw e;
	}
	return { styleId: style.id, created: true, pieces: [...made.values()] };
}
