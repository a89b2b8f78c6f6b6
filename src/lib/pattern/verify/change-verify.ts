import { pathLength } from '../kernel';
import { DEFAULT_SHAPING_TOLERANCES, LABELLED_KINDS, SHAPING_KINDS, shapingChecks, type LedgerEntry } from '../ledger';
import { pieceMetrics, type PieceMetrics } from '../metrics';
import type { SeamPair } from '../panels';
import { SEAM_SNAP_MM } from '../panels/panel-tolerances';
import { divergenceCandidates, seamWedge } from '../panels/seam-wedge';
import type { Piece } from '../piece-schema';
import { changeRecompute, type ChangePiece, type ChangeStep, type StepOutcome } from '../recipe/change';
import { pieceGeometryDifference, REPLAY_TOLERANCE_MM } from './piece-compare';
import { seamPairMeasure, type SeamPairData } from './seam-measure';

/**
 * What the server checks before it stores a style change (pure, so the browser runs it too): every step
 * recomputed from its sources gives the pieces that were sent (0.01 mm); across the pieces of each step
 * the shaping ledger balances at every apex and divergence point (the total angle before, over all
 * sources, equals the total after, over all results, or the difference is declared), the area outside
 * the wedges is kept (summed over the pieces), and the seams the step sews together are true, measured
 * with the style's own seam pairs where the step names them.
 */

export type ChangeProblemCode = 'change_invalid' | 'replay_refused' | 'replay_mismatch' | 'shaping_not_kept' | 'seam_lengths_differ';

export interface ChangeProblem {
	readonly code: ChangeProblemCode;
	readonly message: string;
	readonly details?: readonly string[];
	/** Which new piece (index in the change's pieces) and by how much it differs (replay_mismatch). */
	readonly pieceIndex?: number;
	readonly distanceMm?: number;
}

export interface ChangeCheck {
	readonly code: 'change_replayed' | 'apex_ledger_matches_pieces' | 'apex_balanced_across_pieces' | 'seam_wedge_measured' | 'area_kept_across_pieces' | 'seam_sewn_true';
	readonly passed: boolean;
	readonly step: number;
	readonly apexId?: string;
	readonly message: string;
}

/** A stored seam pair of the style, with the pieces (database ids) its edges belong to. */
export interface StoredSeamPair extends SeamPairData {
	readonly aPieceId: string;
	readonly bPieceId: string;
}

export type ChangeVerdict =
	| {
			readonly ok: true;
			/** The server's own new pieces (the recomputed geometry with the names and cuts sent), in the order sent. */
			readonly pieces: readonly { readonly piece: Piece; readonly metrics: PieceMetrics }[];
			readonly ledger: readonly LedgerEntry[];
			readonly checks: readonly ChangeCheck[];
	  }
	| { readonly ok: false; readonly problem: ChangeProblem };

const fail = (problem: ChangeProblem): ChangeVerdict => ({ ok: false, problem });
/** Each piece's metrics once (the checks read them several times; pieces are never mutated). */
const measured = new WeakMap<Piece, PieceMetrics>();
function metricsOf(p: Piece): PieceMetrics {
	let m = measured.get(p);
	if (!m) measured.set(p, (m = pieceMetrics(p)));
	return m;
}
const deg = (rad: number) => `${((rad * 180) / Math.PI).toFixed(2)}°`;
const isShaping = (k: string) => (SHAPING_KINDS as readonly string[]).includes(k);
const isLabelled = (k: string) => (LABELLED_KINDS as readonly string[]).includes(k);

function stepSeams(step: ChangeStep): SeamPair[] {
	const p = step.params as { seam?: SeamPair; seams?: SeamPair[] };
	if (step.op === 'join' && p.seam) return [p.seam];
	if (step.op === 'carry' && p.seams) return p.seams;
	return [];
}

function apexTotals(pieces: readonly Piece[]): Map<string, { angle: number; label: string }> {
	const out = new Map<string, { angle: number; label: string }>();
	for (const p of pieces) {
		for (const t of metricsOf(p).apexTotals) {
			const acc = out.get(t.apexId) ?? { angle: 0, label: t.label };
			acc.angle += t.totalAngleRad;
			out.set(t.apexId, acc);
		}
	}
	return out;
}

/** The cross-piece checks of one recomputed step; the first failure is returned as a problem. */
export function changeStepChecks(i: number, step: ChangeStep, o: StepOutcome, stored: readonly StoredSeamPair[], sourceIds: readonly (string | null)[]): { checks: ChangeCheck[]; problem?: ChangeProblem } {
	const checks: ChangeCheck[] = [];
	const tol = DEFAULT_SHAPING_TOLERANCES;
	const name = `Step ${i + 1} (${step.op})`;
	// single-piece steps made on a source before the step keep shaping as a save of that piece would
	for (const [k, r] of o.sourceRecipes.entries()) {
		if (!step.sources[k].recipe?.length) continue;
		const failed = shapingChecks(r.before, o.sources[k], r.ledger).filter((c) => !c.passed);
		if (failed.length) return { checks, problem: { code: 'shaping_not_kept', message: `${name}, source ${k + 1}: shaping is not kept by the steps made on it first: ${failed.map((c) => c.message).join(' ')}` } };
	}
	const entries = [...o.result.ledgerEntries, ...(step.declared ?? [])];
	const seams = stepSeams(step);
	// seams sewn by the step: true in length, and measured with the style's pair where one is named
	const byId = new Map(o.sources.map((p) => [p.id, p]));
	const wedges = new Map<string, number>();
	for (const s of seams) {
		// a seam with a divergence point: the parts above it coincide, its wedge is checked at the apex below
		const a = byId.get(s.a.pieceId);
		const b = byId.get(s.b.pieceId);
		let wedge = false;
		for (const D of a && b ? divergenceCandidates(a, b, s.a.edge, s.b.edge, SEAM_SNAP_MM).slice(0, 1) : []) {
			const w = seamWedge(s.a.edge, s.b.edge, D, SEAM_SNAP_MM);
			if (typeof w === 'string') continue;
			wedges.set(D.id, (wedges.get(D.id) ?? 0) + w.angleRad);
			wedge = true;
		}
		if (!wedge) {
			const la = pathLength(s.a.edge);
			const lb = pathLength(s.b.edge);
			const diff = la - lb - s.allowedEaseMm;
			const ok = Math.abs(diff) <= s.toleranceMm;
			const msg = `${name}: seam "${s.id}" sews ${la.toFixed(2)} mm to ${lb.toFixed(2)} mm${ok ? '' : `, ${Math.abs(diff).toFixed(2)} mm ${diff > 0 ? 'too long' : 'too short'} (tolerance ${s.toleranceMm} mm)`}.`;
			checks.push({ code: 'seam_sewn_true', passed: ok, step: i, message: msg });
			if (!ok) return { checks, problem: { code: 'seam_lengths_differ', message: msg } };
		}
		const storedId = (s as { storedId?: string }).storedId;
		if (storedId) {
			const sp = stored.find((x) => x.id === storedId);
			const ai = sp ? sourceIds.indexOf(sp.aPieceId) : -1;
			const bi = sp ? sourceIds.indexOf(sp.bPieceId) : -1;
			if (!sp || ai < 0 || bi < 0) return { checks, problem: { code: 'change_invalid', message: `${name}: seam "${s.id}" names a seam pair of the style that does not join two of its pieces.` } };
			const m = seamPairMeasure(sp, o.sources[ai], o.sources[bi]);
			checks.push({ code: 'seam_sewn_true', passed: m.withinTolerance, step: i, message: `${name}: ${m.message}` });
			if (!m.withinTolerance) return { checks, problem: { code: 'seam_lengths_differ', message: `${name}: ${m.message}` } };
		}
	}
	// the ledger across pieces, apex by apex
	const before = apexTotals(o.sources);
	const after = apexTotals(o.result.pieces);
	const apexIds = new Set([...before.keys(), ...after.keys(), ...wedges.keys()]);
	for (const e of entries) if (e.apexId) apexIds.add(e.apexId);
	for (const apexId of apexIds) {
		const mine = entries.filter((e) => e.apexId === apexId);
		const sum = (f: (e: LedgerEntry) => boolean) => mine.filter(f).reduce((t, e) => t + e.angleRad, 0);
		const dartsBefore = before.get(apexId)?.angle ?? 0;
		const dartsAfter = after.get(apexId)?.angle ?? 0;
		const wedgeBefore = wedges.get(apexId) ?? 0;
		const inSeamsAfter = wedgeBefore + sum((e) => e.kind === 'seam');
		const label = after.get(apexId)?.label || before.get(apexId)?.label;
		const where = `${name}, ${label ? `${label} (${apexId})` : `apex ${apexId}`}`;
		const postedDarts = sum((e) => isShaping(e.kind) && e.kind !== 'seam');
		const truthful = Math.abs(dartsAfter - dartsBefore - postedDarts) <= tol.angleRad;
		checks.push({ code: 'apex_ledger_matches_pieces', passed: truthful, step: i, apexId, message: truthful ? `${where}: the ledger matches the darts and pleats of the pieces.` : `${where}: the darts and pleats changed by ${deg(dartsAfter - dartsBefore)} over the pieces but the ledger records ${deg(postedDarts)}.` });
		if (!truthful) return { checks, problem: { code: 'shaping_not_kept', message: checks[checks.length - 1].message } };
		if (wedgeBefore > 0) {
			const taken = -sum((e) => e.kind === 'seam' && e.angleRad < 0);
			const ok = Math.abs(taken - wedgeBefore) <= tol.angleRad;
			checks.push({ code: 'seam_wedge_measured', passed: ok, step: i, apexId, message: ok ? `${where}: the panel-seam wedges measure ${deg(wedgeBefore)}, as the ledger says.` : `${where}: the panel-seam wedges measure ${deg(wedgeBefore)} but the ledger takes ${deg(taken)} out of them.` });
			if (!ok) return { checks, problem: { code: 'shaping_not_kept', message: checks[checks.length - 1].message } };
		}
		const totalBefore = dartsBefore + wedgeBefore;
		const totalAfter = dartsAfter + inSeamsAfter;
		const declared = sum((e) => isLabelled(e.kind));
		const balanced = Math.abs(totalAfter - totalBefore - declared) <= tol.angleRad;
		const parts = `${deg(totalBefore)} before over the sources (darts and pleats ${deg(dartsBefore)}, panel-seam wedges ${deg(wedgeBefore)}), ${deg(totalAfter)} after over the results (darts and pleats ${deg(dartsAfter)}, in seams ${deg(inSeamsAfter)})`;
		checks.push({ code: 'apex_balanced_across_pieces', passed: balanced, step: i, apexId, message: balanced ? `${where}: shaping kept, ${parts}${Math.abs(declared) > tol.angleRad ? `, declared ${deg(declared)}` : ''}.` : `${where}: ${deg(totalAfter - totalBefore - declared)} of shaping is ${totalAfter - totalBefore - declared < 0 ? 'lost' : 'added'} without a declared change: ${parts}.` });
		if (!balanced) return { checks, problem: { code: 'shaping_not_kept', message: checks[checks.length - 1].message } };
	}
	const areaBefore = o.sources.reduce((t, p) => t + metricsOf(p).areaMm2, 0);
	const areaAfter = o.result.pieces.reduce((t, p) => t + metricsOf(p).areaMm2, 0);
	const posted = entries.reduce((t, e) => t + e.areaMm2, 0);
	const areaTol = tol.areaMm2 * Math.max(o.sources.length, o.result.pieces.length);
	const areaOk = Math.abs(areaAfter - areaBefore - posted) <= areaTol;
	const areaMsg = `${name}: area outside the wedges ${areaBefore.toFixed(1)} mm² over the sources, ${areaAfter.toFixed(1)} mm² over the results${Math.abs(posted) > 0 ? ` (ledger ${posted.toFixed(1)} mm²)` : ''}.`;
	checks.push({ code: 'area_kept_across_pieces', passed: areaOk, step: i, message: areaMsg });
	if (!areaOk) return { checks, problem: { code: 'shaping_not_kept', message: `Area not kept: ${areaMsg}` } };
	return { checks };
}

/**
 * Verifies a change against the base versions of its stored sources (pieceId → geometry) and the
 * style's stored seam pairs. `pieces` are the new pieces as sent: exactly the results no later step uses.
 */
export function changeVerify(bases: ReadonlyMap<string, Piece>, steps: readonly ChangeStep[], pieces: readonly ChangePiece[], stored: readonly StoredSeamPair[] = []): ChangeVerdict {
	if (steps.length === 0) return fail({ code: 'change_invalid', message: 'A change needs at least one step.' });
	const rc = changeRecompute(bases, steps);
	if (!rc.ok) return fail({ code: rc.code, message: `${rc.message} Nothing was saved.` });
	const want = new Set(rc.unused.map((u) => `${u.step}:${u.result}`));
	const seen = new Set<string>();
	for (const [n, p] of pieces.entries()) {
		const k = `${p.step}:${p.result}`;
		if (!want.has(k) || seen.has(k)) return fail({ code: 'change_invalid', message: `New piece ${n + 1} ("${p.name}") names result ${p.result + 1} of step ${p.step + 1}, which is not a new piece of this change (or is named twice).` });
		seen.add(k);
	}
	if (seen.size !== want.size) return fail({ code: 'change_invalid', message: `The change makes ${want.size} new pieces but ${seen.size} were sent; send every result no later step uses.` });
	const checks: ChangeCheck[] = [];
	const ledger: LedgerEntry[] = [];
	for (const [i, o] of rc.steps.entries()) {
		const ids = steps[i].sources.map((s) => ('pieceId' in s ? s.pieceId : null));
		const r = changeStepChecks(i, steps[i], o, stored, ids);
		checks.push(...r.checks);
		if (r.problem) return fail({ ...r.problem, message: `${r.problem.message} Nothing was saved.`, details: r.checks.filter((c) => !c.passed).map((c) => c.message) });
		ledger.push(...o.result.ledgerEntries, ...(steps[i].declared ?? []));
	}
	const out: { piece: Piece; metrics: PieceMetrics }[] = [];
	for (const [n, p] of pieces.entries()) {
		const computed = rc.steps[p.step].result.pieces[p.result];
		const diff = pieceGeometryDifference(p.geometry, computed);
		if (diff) {
			const far = Number.isFinite(diff.distanceMm) ? ` (${diff.distanceMm.toFixed(3)} mm off, ${REPLAY_TOLERANCE_MM} mm allowed)` : '';
			return fail({ code: 'replay_mismatch', pieceIndex: n, distanceMm: diff.distanceMm, message: `New piece ${n + 1} ("${p.name}") is not what step ${p.step + 1} (${steps[p.step].op}) gives from its sources: ${diff.where}${far}. Nothing was saved.` });
		}
		// name, cut and the name label are the pattern cutter's words for the new piece; the geometry is the server's
		const piece: Piece = { ...computed, name: p.name, cut: p.cut, labels: p.geometry.labels };
		// labels, name and cut do not enter the metrics: the computed piece's serve
		out.push({ piece, metrics: metricsOf(computed) });
	}
	checks.unshift({ code: 'change_replayed', passed: true, step: 0, message: `${steps.length} step${steps.length === 1 ? '' : 's'} recomputed from their sources; ${pieces.length} new piece${pieces.length === 1 ? '' : 's'} as sent, within ${REPLAY_TOLERANCE_MM} mm.` });
	return { ok: true, pieces: out, ledger, checks };
}
