import { stepParamsCarry } from '../anchors/step-anchors';
import { shapingChecks } from '../ledger';
import { pieceMetrics } from '../metrics';
import type { MeasurementsMm } from '../measurements';
import type { Piece } from '../piece-schema';
import { pieceSeams } from '../piece-seams';
import { changeStepChecks } from '../verify/change-verify';
import { seamPairMeasure } from '../verify/seam-measure';
import { sizeReplay, type SizeFailure, type SizeReplay, type SizeReplayOptions } from './size-replay';
import type { StyleRecipe } from './style-recipe';

/**
 * One size of a size run as it is reported: every piece made (its metrics), every step that could not be
 * made again (in the trade's words), and the checks: the shaping ledger per apex for every step and every
 * style change (as a save would check it), and the style's seam pairs measured on this size's pieces.
 */

export interface SizePieceResult {
	readonly pieceId: string;
	readonly name: string;
	readonly made: boolean;
	readonly versionNumber: number;
	readonly metrics: {
		readonly areaMm2: number;
		readonly seamLengthMm: number;
		readonly seams: readonly { readonly name: string; readonly lengthMm: number }[];
		readonly apexes: readonly { readonly apexId: string; readonly label: string; readonly totalAngleDeg: number }[];
	} | null;
}

export interface SizeCheck {
	readonly code: string;
	readonly passed: boolean;
	readonly pieceId?: string;
	readonly apexId?: string;
	readonly message: string;
}

export interface SizeResult {
	readonly pieces: readonly SizePieceResult[];
	readonly failures: readonly SizeFailure[];
	readonly checks: readonly SizeCheck[];
	readonly stepsDone: number;
	/** The heads as made on this size, by piece id (not sent over the API; kept for nest views and sets). */
	readonly heads: ReadonlyMap<string, Piece>;
	readonly replay: SizeReplay;
}

const deg = (rad: number) => (rad * 180) / Math.PI;

/** A piece's metrics as a size run reports them (also the base size's, for differences). */
export function sizePieceMetrics(p: Piece): NonNullable<SizePieceResult['metrics']> {
	const m = pieceMetrics(p);
	return {
		areaMm2: m.areaMm2,
		seamLengthMm: m.seamLengthMm,
		seams: pieceSeams(p).map((s) => ({ name: s.name, lengthMm: s.lengthMm })),
		apexes: m.apexTotals.map((a) => ({ apexId: a.apexId, label: a.label, totalAngleDeg: deg(a.totalAngleRad) }))
	};
}

/** Replays the style on one measurement set and reports it. */
export function sizeResult(style: StyleRecipe, mm: MeasurementsMm, options: SizeReplayOptions = {}): SizeResult {
	const replay = sizeReplay(style, mm, options);
	const heads = new Map<string, Piece>();
	const pieces: SizePieceResult[] = style.pieces.map((p) => {
		const head = p.versions[p.versions.length - 1];
		const made = replay.versions.get(p.id)?.get(head?.number ?? 0);
		if (made) heads.set(p.id, made.piece);
		return { pieceId: p.id, name: p.name, made: Boolean(made), versionNumber: head?.number ?? 0, metrics: made ? sizePieceMetrics(made.piece) : null };
	});
	const checks: SizeCheck[] = [];
	for (const p of style.pieces) {
		for (const [n, v] of replay.versions.get(p.id) ?? []) {
			if (n === 1) continue;
			for (const c of shapingChecks(v.before, v.piece, v.ledger)) checks.push({ ...c, pieceId: p.id, message: `${p.name} v${n}: ${c.message}` });
		}
	}
	for (const c of replay.changes.values()) {
		for (const [i, o] of c.steps.entries()) {
			const step = c.carried[i];
			// the style's stored seam pairs are measured below, on this size's pieces
			const params = JSON.parse(JSON.stringify(step.params ?? {}), (k, v) => (k === 'storedId' ? undefined : v));
			const r = changeStepChecks(i, { ...step, params }, o, [], step.sources.map(() => null));
			checks.push(...r.checks.map((x) => ({ code: x.code, passed: x.passed, ...(x.apexId ? { apexId: x.apexId } : {}), message: x.message })));
			if (r.problem) checks.push({ code: r.problem.code, passed: false, message: r.problem.message });
		}
	}
	for (const sp of style.seamPairs) {
		const a = heads.get(sp.aPieceId);
		const b = heads.get(sp.bPieceId);
		const baseA = style.pieces.find((p) => p.id === sp.aPieceId)?.versions.at(-1)?.geometry;
		const baseB = style.pieces.find((p) => p.id === sp.bPieceId)?.versions.at(-1)?.geometry;
		if (!a || !b || !baseA || !baseB) {
			checks.push({ code: 'seam_pair_measured', passed: false, message: `${sp.label}: a piece it joins was not made on this size.` });
			continue;
		}
		const ea = stepParamsCarry(sp.a, [baseA], [a], false);
		const eb = stepParamsCarry(sp.b, [baseB], [b], false);
		if (!ea.ok || !eb.ok) {
			checks.push({ code: 'seam_pair_measured', passed: false, message: `${sp.label}: ${!ea.ok ? ea.message : !eb.ok ? eb.message : ''}` });
			continue;
		}
		const m = seamPairMeasure({ ...sp, a: ea.params as typeof sp.a, b: eb.params as typeof sp.b }, a, b);
		checks.push({ code: 'seam_pair_measured', passed: m.withinTolerance, message: m.message });
	}
	return { pieces, failures: replay.failures, checks, stepsDone: replay.stepsDone, heads, replay };
}
