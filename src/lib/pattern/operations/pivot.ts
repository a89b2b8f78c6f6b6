import { z } from 'zod';
import { ledgerEntry, type LedgerEntry } from '../ledger';
import { fmtDeg, fmtMm, refuse, succeed, type OperationResult } from '../operation-result';
import { apexById, dartById, wedgeGeometry } from '../piece';
import { vecSchema, type Dart, type Piece } from '../piece-schema';
import { carryMarkings, rotationMotion } from './carry-markings';
import { openWedgesKeepingStill } from './still-side';
import { reapplyPullBack } from './pull-back';
import { dartPressByPractice, pressPracticeNote } from '../press-practice';

export const pivotParamsSchema = z.object({
	dartId: z.string().min(1),
	/** New opening point S on the outline. */
	to: vecSchema,
	/** Id for the moved dart (default: keeps its id). */
	newDartId: z.string().min(1).optional()
});
export type PivotParams = z.infer<typeof pivotParamsSchema>;

/**
 * pivot (primer §1): close the dart and open it at S by rotating the chain from the moving leg to S
 * about the apex by the dart angle. The new dart has the same apex and angle, opening between S and S'.
 */
export function pivot(piece: Piece, params: PivotParams): OperationResult {
	const dart = dartById(piece, params.dartId);
	if (!dart) return refuse('unknown_dart', `There is no dart "${params.dartId}" on this piece.`);
	const apex = apexById(piece, dart.apexId);
	if (!apex) return refuse('unknown_apex', `Dart "${dart.id}" refers to apex "${dart.apexId}", which is not on the piece.`);
	const g = wedgeGeometry(apex.point, dart.leg1End, dart.leg2End);
	const r = openWedgesKeepingStill(piece, dart, [{ at: params.to, angleRad: g.angleRad }], 0, () => `Dart "${dart.id}"`);
	if (!r.ok) return refuse(r.code, r.message);
	const o = r.value.openings[0];
	const carried = carryMarkings(piece, (p) => rotationMotion(apex.point, r.value.rotationForPoint(p)), new Set([dart.id]), [apex.point], {
		grainlineKeepsDirection: true
	});
	const newId = params.newDartId ?? dart.id;
	const moved: Dart = {
		id: newId,
		apexId: dart.apexId,
		leg1End: o.leg1End,
		leg2End: o.leg2End,
		movingLeg: o.movedLeg,
		pullBack: reapplyPullBack(apex.point, dart, o.leg1End, o.leg2End)
	};
	const placed: Piece = {
		...piece,
		...carried,
		outline: r.value.outline,
		darts: carried.darts.map((d) => (d.id === dart.id ? moved : d))
	};
	const pressToward = dartPressByPractice(placed, moved);
	const next: Piece = pressToward ? { ...placed, darts: placed.darts.map((d) => (d.id === newId ? { ...d, pressToward } : d)) } : placed;
	const ng = wedgeGeometry(apex.point, o.leg1End, o.leg2End);
	const where = apex.label || apex.id;
	const entries: LedgerEntry[] = [
		ledgerEntry({ apexId: apex.id, kind: 'dart', refId: dart.id, label: `dart "${dart.id}" closed`, angleRad: -g.angleRad }),
		ledgerEntry({ apexId: apex.id, kind: 'dart', refId: newId, label: `dart "${newId}" opened at the new point`, angleRad: ng.angleRad })
	];
	const notes = [...r.value.notes];
	if (r.still) notes.push(`The side that holds ${r.still.name} stayed still; the other side turned.`);
	if (dart.cap) notes.push('The cap was cleared: true it again for the new position.');
	notes.push(pressPracticeNote(newId, pressToward));
	if (dart.pullBack && !moved.pullBack) notes.push(`The ${fmtMm(dart.pullBack.clearanceMm)} clearance no longer fits the new dart and was removed.`);
	// the input piece is clean (every stored version and every result is checked): each side the engine
	// turned or kept is clean on its own, so only crossings between them, and of the new legs, are searched
	return succeed(next, entries, {
		op: 'pivot',
		summary: `Dart "${dart.id}" (${fmtDeg(g.angleRad)} at ${where}) moved: intake ${fmtMm(g.intakeMm)} at ${fmtMm(g.leg1LengthMm)} becomes ${fmtMm(ng.intakeMm)} at ${fmtMm(ng.leg1LengthMm)}.`,
		values: {
			angleRad: ng.angleRad,
			oldIntakeMm: g.intakeMm,
			newIntakeMm: ng.intakeMm,
			oldLegLengthMm: g.leg1LengthMm,
			newLegLengthMm: ng.leg1LengthMm
		},
		notes
	}, { cleanParts: r.value.rigidParts });
}
