import type { z } from 'zod';
import type { Db } from '../db';
import type { Role, VersionState } from '../db/schema';
import { membershipsOfStudio } from '../repositories/memberships';
import { stylesInStudio } from '../repositories/styles';
import { versionCommentsInsert } from '../repositories/version-comments';
import { versionReviewsInsert, versionReviewsLastProposer } from '../repositories/version-reviews';
import { versionsById, versionsStateSet, versionsSupersedeOthers } from '../repositories/versions';
import { SIGNERS } from '../authz';
import { versionProposedMail, versionReviewedMail } from '../notify/mails';
import { notify } from '../notify/send';
import { pieceOr404 } from './access';
import { reviewItems } from './review-items';
import type { versionStateSchema } from './schemas';

export type StateChange =
	| { ok: true; version: { id: string; state: VersionState } }
	| { ok: false; status: 403 | 404 | 409; code: string; message: string; fields?: Record<string, string[]> };

type Action = z.output<typeof versionStateSchema>;

const refuse = (status: 403 | 404 | 409, code: string, message: string, fields?: Record<string, string[]>): StateChange => ({ ok: false, status, code, message, fields });

/**
 * The review of a version:
 *   propose    draft → proposed (pattern cutter, owner); the signers get an e-mail;
 *   withdraw   proposed → draft, by its author or whoever proposed it;
 *   sign_off   proposed → signed_off (designer, owner), superseding the piece's earlier signed-off
 *              version; every seam warning and open fit note on it must be acknowledged, and is recorded;
 *   send_back  proposed → draft with a reason (designer, owner); the author gets an e-mail.
 * Each step is recorded (version_reviews) with who, when, the comment or reason. `origin` (the app's
 * address for links) is null where no e-mail should go (the demo seed).
 */
export async function versionStateChange(
	db: Db,
	input: { studioId: string; pieceId: string; versionId: string; action: Action; user: { id: string; name: string }; role: Role; origin: string | null }
): Promise<StateChange> {
	const piece = await pieceOr404(db, input.studioId, input.pieceId);
	const { action, user } = input;
	const r = await db.transaction().execute(async (tx): Promise<StateChange & { authorId?: string | null; number?: number; message?: string }> => {
		await tx.selectFrom('pieces').select('id').where('id', '=', piece.id).forUpdate().execute();
		const v = await versionsById(tx, input.pieceId, input.versionId);
		if (!v) return refuse(404, 'not_found', 'No such version of this piece.');
		const stateText = v.state.replace('_', ' ');
		if (action.action === 'propose') {
			if (v.state !== 'draft') return refuse(409, 'state', `Version ${v.number} is ${stateText}, not a draft: only a draft can be proposed.`);
			await versionsStateSet(tx, v.id, 'proposed');
			await versionReviewsInsert(tx, { versionId: v.id, kind: 'proposed', actorId: user.id, comment: action.comment });
			if (action.comment) await versionCommentsInsert(tx, { versionId: v.id, authorId: user.id, body: action.comment });
			return { ok: true, version: { id: v.id, state: 'proposed' }, authorId: v.authorId, number: v.number, message: v.message };
		}
		if (v.state !== 'proposed') {
			const what = action.action === 'sign_off' ? 'signed off' : action.action === 'send_back' ? 'sent back' : 'withdrawn';
			return refuse(409, 'not_proposed', `Version ${v.number} is ${stateText}; only a proposed version can be ${what}.${v.state === 'draft' && action.action === 'sign_off' ? ' Its pattern cutter proposes it first.' : ''}`);
		}
		if (action.action === 'withdraw') {
			const proposer = await versionReviewsLastProposer(tx, v.id);
			if (user.id !== v.authorId && user.id !== proposer) {
				return refuse(403, 'forbidden', `Only the author of version ${v.number}${v.authorName ? ` (${v.authorName})` : ''} or whoever proposed it can withdraw the proposal.`);
			}
			await versionsStateSet(tx, v.id, 'draft');
			await versionReviewsInsert(tx, { versionId: v.id, kind: 'withdrawn', actorId: user.id });
			return { ok: true, version: { id: v.id, state: 'draft' } };
		}
		if (action.action === 'send_back') {
			await versionsStateSet(tx, v.id, 'draft');
			await versionReviewsInsert(tx, { versionId: v.id, kind: 'sent_back', actorId: user.id, comment: action.reason });
			await versionCommentsInsert(tx, { versionId: v.id, authorId: user.id, body: `Sent back: ${action.reason}` });
			return { ok: true, version: { id: v.id, state: 'draft' }, authorId: v.authorId, number: v.number };
		}
		const items = await reviewItems(tx, piece.styleId, piece.id, v);
		const given = new Set(action.acknowledged);
		const missing = items.filter((i) => !given.has(i.id));
		if (missing.length > 0) {
			return refuse(
				409,
				'needs_acknowledgement',
				`Version ${v.number} cannot be signed off until you acknowledge ${missing.length === 1 ? 'this' : `these ${missing.length}`}: ${missing.map((m) => m.message).join(' · ')}`,
				{ acknowledged: missing.map((m) => m.id) }
			);
		}
		await versionsSupersedeOthers(tx, input.pieceId, v.id);
		await versionsStateSet(tx, v.id, 'signed_off', user.id);
		await versionReviewsInsert(tx, { versionId: v.id, kind: 'signed_off', actorId: user.id, comment: action.comment, acknowledged: items });
		if (action.comment) await versionCommentsInsert(tx, { versionId: v.id, authorId: user.id, body: action.comment });
		return { ok: true, version: { id: v.id, state: 'signed_off' }, authorId: v.authorId, number: v.number };
	});
	if (!r.ok || input.origin === null || r.number === undefined) return r.ok ? { ok: true, version: r.version } : r;
	const style = await stylesInStudio(db, input.studioId, piece.styleId);
	const ref = {
		styleName: style?.name ?? 'the style',
		pieceName: piece.name,
		number: r.number,
		link: `${input.origin}/studios/${input.studioId}/styles/${piece.styleId}/pieces/${piece.id}/versions/${r.version.id}`
	};
	if (action.action === 'propose') {
		const signers = (await membershipsOfStudio(db, input.studioId)).filter((m) => (SIGNERS as readonly Role[]).includes(m.role)).map((m) => m.userId);
		await notify(db, 'version_proposed', signers, user.id, (to) => versionProposedMail(to.email, { ...ref, proposerName: user.name, message: r.message ?? '' }));
	} else if (action.action === 'sign_off' || action.action === 'send_back') {
		const comment = action.action === 'send_back' ? action.reason : action.comment;
		const outcome = action.action === 'sign_off' ? 'signed_off' : 'sent_back';
		await notify(db, 'version_reviewed', [r.authorId ?? null], user.id, (to) => versionReviewedMail(to.email, { ...ref, reviewerName: user.name, outcome, comment }));
	}
	return { ok: true, version: r.version };
}
