import { z } from 'zod';
import { vecAdd, vecDistance, vecScale, vecAngleBetween, vecSub, type Vec } from '../kernel';
import { ledgerEntry } from '../ledger';
import { fmtDeg, fmtMm, refuse, succeed, type OperationResult } from '../operation-result';
import { apexById, dartById, wedgeGeometry } from '../piece';
import type { Dart, Piece } from '../piece-schema';

/** Legs must agree to this (mm) for a pulled-back dart to keep equal legs. */
export const LEG_EQUALITY_TOLERANCE_MM = 0.1;

const finite = () => z.number().refine((n) => Number.isFinite(n), { message: 'must be a finite number' });

export const pullBackParamsSchema = z.object({
	dartId: z.string().min(1),
	/** Distance from the apex back along the bisector to the sewn point (typically 15–25 mm). */
	clearanceMm: finite()
});
export type PullBackParams = z.infer<typeof pullBackParamsSchema>;

export type SewnPoint = { sewnPoint: Vec; sewnLegLengthMm: number; sewnAngleRad: number };

/**
 * The sewn point of a dart pulled back by c (primer §4, reference-values row 19):
 * L' = √((L·cos(θ/2) − c)² + (L·sin(θ/2))²), θ' = 2·atan(L·sin(θ/2) / (L·cos(θ/2) − c)).
 */
export function sewnPointFor(apex: Vec, leg1End: Vec, leg2End: Vec, clearanceMm: number): { ok: true; value: SewnPoint } | { ok: false; code: 'legs_unequal' | 'clearance_too_long' | 'clearance_not_positive'; message: string } {
	const g = wedgeGeometry(apex, leg1End, leg2End);
	if (!(clearanceMm > 0)) return { ok: false, code: 'clearance_not_positive', message: `The clearance must be more than 0 mm (got ${clearanceMm} mm).` };
	if (Math.abs(g.leg1LengthMm - g.leg2LengthMm) > LEG_EQUALITY_TOLERANCE_MM) {
		return {
			ok: false,
			code: 'legs_unequal',
			message: `The dart legs are ${fmtMm(g.leg1LengthMm)} and ${fmtMm(g.leg2LengthMm)}; true them to equal length before pulling the point back.`
		};
	}
	const L = (g.leg1LengthMm + g.leg2LengthMm) / 2;
	const reach = L * Math.cos(g.angleRad / 2);
	if (clearanceMm >= reach) {
		return {
			ok: false,
			code: 'clearance_too_long',
			message: `A clearance of ${fmtMm(clearanceMm)} would reach past the dart mouth: this dart is only ${fmtMm(reach)} deep along its centre (legs ${fmtMm(L)}).`
		};
	}
	const T = vecAdd(apex, vecScale(g.bisector, clearanceMm));
	return {
		ok: true,
		value: {
			sewnPoint: T,
			sewnLegLengthMm: (vecDistance(T, leg1End) + vecDistance(T, leg2End)) / 2,
			sewnAngleRad: Math.abs(vecAngleBetween(vecSub(leg2End, T), vecSub(leg1End, T)))
		}
	};
}

/** Re-apply a dart's clearance after its legs moved (used by pivot); undefined if it no longer fits. */
export function reapplyPullBack(apex: Vec, dart: Dart, leg1End: Vec, leg2End: Vec): Dart['pullBack'] {
	if (!dart.pullBack) return undefined;
	const r = sewnPointFor(apex, leg1End, leg2End, dart.pullBack.clearanceMm);
	return r.ok ? { clearanceMm: dart.pullBack.clearanceMm, ...r.value } : undefined;
}

/** pull_back: move the sewn dart point back from the apex along the bisector (outline unchanged). */
export function pullBack(piece: Piece, params: PullBackParams): OperationResult {
	const dart = dartById(piece, params.dartId);
	if (!dart) return refuse('unknown_dart', `There is no dart "${params.dartId}" on this piece.`);
	const apex = apexById(piece, dart.apexId);
	if (!apex) return refuse('unknown_apex', `Dart "${dart.id}" refers to apex "${dart.apexId}", which is not on the piece.`);
	const r = sewnPointFor(apex.point, dart.leg1End, dart.leg2End, params.clearanceMm);
	if (!r.ok) return refuse(r.code, `Dart "${dart.id}": ${r.message}`);
	const g = wedgeGeometry(apex.point, dart.leg1End, dart.leg2End);
	const next: Piece = {
		...piece,
		darts: piece.darts.map((d) => (d.id === dart.id ? { ...d, pullBack: { clearanceMm: params.clearanceMm, ...r.value }, cap: undefined } : d))
	};
	const notes = dart.cap ? ['The dart cap was removed: true the dart again (cap) now that its point moved.'] : [];
	return succeed(
		next,
		[ledgerEntry({ apexId: apex.id, kind: 'clearance', refId: dart.id, label: `dart "${dart.id}" point pulled back ${fmtMm(params.clearanceMm)} from ${apex.label || apex.id}`, angleRad: 0 })],
		{
			op: 'pull_back',
			summary: `Dart "${dart.id}" now ends ${fmtMm(params.clearanceMm)} short of ${apex.label || apex.id}: sewn legs ${fmtMm(r.value.sewnLegLengthMm)} (were ${fmtMm((g.leg1LengthMm + g.leg2LengthMm) / 2)}), sewn angle ${fmtDeg(r.value.sewnAngleRad)} (was ${fmtDeg(g.angleRad)}).`,
			values: {
				clearanceMm: params.clearanceMm,
				legLengthMm: (g.leg1LengthMm + g.leg2LengthMm) / 2,
				angleRad: g.angleRad,
				sewnLegLengthMm: r.value.sewnLegLengthMm,
				sewnAngleRad: r.value.sewnAngleRad
			},
			notes
		}
	);
}
