import { error } from '@sveltejs/kit';
import { z } from 'zod';
import { stepAnchorsGiven } from '$lib/pattern/anchors/anchor-text';
import { pieceSchema } from '$lib/pattern/piece-schema';
import { ALL_ROLES, requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { versionsOfPiece } from '$lib/server/repositories/versions';
import { pieceOr404, seesOnlySignedOff, styleOr404, versionOr404 } from '$lib/server/versions/access';
import { versionShown } from '$lib/server/versions/overview';
import { fitNoteShowsOn } from '$lib/fittings/notes';
import { fitNoteJson } from '$lib/server/fittings/view';
import { fitNotesOfPieces } from '$lib/server/repositories/fit-notes';
import { versionCommentsOf } from '$lib/server/repositories/version-comments';
import { versionReviewsOf } from '$lib/server/repositories/version-reviews';
import type { PageServerLoad } from './$types';

const params = z.object({ styleId: z.uuid(), pieceId: z.uuid(), versionId: z.uuid() });

/** One version of a piece, read only: its drawing, checks and ledger, and the way to compare it with the head. */
export const load: PageServerLoad = async (event) => {
	const { studioId, role } = await requireRole(event, ALL_ROLES);
	const notFound = () => error(404, { message: 'No such version.', code: 'not_found' });
	const p = params.safeParse(event.params);
	if (!p.success) notFound();
	const { styleId, pieceId, versionId } = p.data!;
	const style = await styleOr404(db(), studioId, styleId).catch(() => null);
	const piece = await pieceOr404(db(), studioId, pieceId).catch(() => null);
	if (!style || !piece || piece.styleId !== style.id) notFound();
	const v = await versionOr404(db(), piece!.id, versionId, role).catch(() => null);
	if (!v) notFound();
	const head = await versionShown(db(), piece!.id, piece!.headVersionId, role);
	const versions = (await versionsOfPiece(db(), piece!.id, seesOnlySignedOff(role))).map((x) => ({ id: x.id, number: x.number }));
	const metrics = v!.metrics as { ledger?: { apexId: string | null; kind: string; label: string; angleRad: number }[] } | null;
	return {
		style: { id: style!.id, name: style!.name },
		piece: { id: piece!.id, name: piece!.name },
		version: {
			id: v!.id,
			number: v!.number,
			state: v!.state,
			message: v!.message,
			authorName: v!.authorName,
			createdAt: v!.createdAt.toISOString(),
			geometry: pieceSchema.parse(v!.geometry),
			checks: (v!.checks ?? []) as { code: string; passed: boolean; message: string; warning?: boolean }[],
			ledger: metrics?.ledger ?? [],
			recipe: ((v!.recipe ?? []) as { op: string }[]).map((s) => s.op),
			// what each step's points are anchored to (what a size run finds them by), as stored with the step
			recipeAnchors: ((v!.recipe ?? []) as { params?: unknown }[]).map((s) => stepAnchorsGiven(s.params))
		},
		head: head ? { id: head.id, number: head.number } : null,
		versions,
		// fit notes shown on this version (pins), its review record and comment thread
		pins: (await fitNotesOfPieces(db(), [piece!.id])).filter((n) => fitNoteShowsOn(n, piece!.id, v!.number)).map(fitNoteJson),
		reviews: (await versionReviewsOf(db(), v!.id)).map((r) => ({ ...r, createdAt: r.createdAt.toISOString() })),
		comments: (await versionCommentsOf(db(), v!.id)).map((c) => ({ ...c, createdAt: c.createdAt.toISOString() }))
	};
};
