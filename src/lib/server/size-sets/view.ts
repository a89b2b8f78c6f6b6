import type { Role } from '../db/schema';
import type { SizeSetRow, SizeSetSizeRow, SizeSetVersionSummary } from '../repositories/size-sets';
import { seesOnlySignedOff } from '../versions/access';

/** A size's checks as stored: how many passed and failed, and each. */
export interface SizeChecks {
	passed: number;
	failed: number;
	list: { code: string; passed: boolean; message: string; pieceId?: string; apexId?: string }[];
}

const person = (id: string | null, name: string | null) => (id ? { id, name: name ?? '' } : null);

function sizeView(s: SizeSetSizeRow, versions?: readonly SizeSetVersionSummary[]) {
	return {
		id: s.id,
		measurementSetId: s.measurementSetId,
		name: s.name,
		state: s.state,
		signedOffBy: person(s.signedOffBy, s.signedOffByName),
		signedOffAt: s.signedOffAt,
		signOffComment: s.signOffComment,
		checks: s.checks as SizeChecks,
		...(versions
			? {
					pieces: versions
						.filter((v) => v.sizeId === s.id)
						.map((v) => ({
							id: v.id,
							name: v.name,
							cut: v.cut,
							fabric: v.fabric,
							basePieceId: v.basePieceId,
							baseVersionId: v.baseVersionId,
							baseVersionNumber: v.baseVersionNumber,
							metrics: v.metrics,
							checks: v.checks
						}))
				}
			: {})
	};
}

/** The sizes a role sees: the sample room sees signed-off sizes only. */
export function sizesShown(sizes: readonly SizeSetSizeRow[], role: Role): SizeSetSizeRow[] {
	return seesOnlySignedOff(role) ? sizes.filter((s) => s.state === 'signed_off') : [...sizes];
}

/** A size set as the API answers it; with `versions`, each size's pieces (without geometry). */
export function sizeSetView(set: SizeSetRow, sizes: readonly SizeSetSizeRow[], versions?: readonly SizeSetVersionSummary[]) {
	const own = sizes.filter((s) => s.sizeSetId === set.id);
	return {
		id: set.id,
		styleId: set.styleId,
		sizeRunId: set.sizeRunId,
		name: set.name,
		createdBy: person(set.createdBy, set.createdByName),
		createdAt: set.createdAt,
		signedOff: own.filter((s) => s.state === 'signed_off').length,
		sizes: own.map((s) => sizeView(s, versions))
	};
}
export type SizeSetView = ReturnType<typeof sizeSetView>;
