import type { Db, DbOrTx } from '../db';
import type { Role } from '../db/schema';
import { ApiError } from '../http-errors';
import { sizeSetSizesLock, sizeSetSizesOf, sizeSetSizesSignOff, sizeSetsById, sizeSetVersionsOf, type SizeSetRow } from '../repositories/size-sets';
import type { SizeSetSignOff } from './schemas';
import { sizeSetView, sizesShown, type SizeChecks } from './view';

/** A set of the studio as the role sees it (404 for another studio's, or for the sample room before any size is signed off). */
export async function sizeSetOr404(db: DbOrTx, studioId: string, id: string, role: Role): Promise<{ set: SizeSetRow; view: ReturnType<typeof sizeSetView> }> {
	const set = await sizeSetsById(db, studioId, id);
	const sizes = set ? sizesShown(await sizeSetSizesOf(db, [set.id]), role) : [];
	if (!set || sizes.length === 0) throw new ApiError(404, 'not_found', 'No such size set in this studio.');
	const versions = await sizeSetVersionsOf(db, sizes.map((s) => s.id));
	return { set, view: sizeSetView(set, sizes, versions) };
}

/**
 * Signs sizes of a set off, recording who and when: the sizes listed, or all that are still drafts. In one
 * transaction with the set's sizes locked: 409 when a size listed (or every size, for "all") is signed off
 * already, 422 for a size not of this set, and 422 when a size has checks that did not pass and the signer
 * has not acknowledged them.
 */
export async function sizeSetSignOff(db: Db, a: { set: SizeSetRow; userId: string; body: SizeSetSignOff }): Promise<string[]> {
	return db.transaction().execute(async (tx) => {
		const locked = await sizeSetSizesLock(tx, a.set.id);
		const sizes = await sizeSetSizesOf(tx, [a.set.id]);
		let targets: typeof sizes;
		if (a.body.sizes === 'all') {
			targets = sizes.filter((s) => s.state === 'draft');
			if (targets.length === 0) throw new ApiError(409, 'already_signed_off', 'Every size of this set is signed off already.');
		} else {
			const unknown = a.body.sizes.filter((id) => !locked.some((s) => s.id === id));
			if (unknown.length) throw new ApiError(422, 'unknown_size', 'Some sizes listed are not sizes of this set.', { sizes: unknown.map((id) => `${id} is not a size of this set.`) });
			targets = sizes.filter((s) => (a.body.sizes as string[]).includes(s.id));
			const done = targets.filter((s) => s.state === 'signed_off');
			if (done.length) {
				const who = (s: (typeof done)[number]) => `${s.name} was signed off${s.signedOffByName ? ` by ${s.signedOffByName}` : ''} on ${s.signedOffAt?.toISOString().slice(0, 10)}.`;
				throw new ApiError(409, 'already_signed_off', `${done.map((s) => s.name).join(', ')} ${done.length === 1 ? 'is' : 'are'} signed off already.`, { sizes: done.map(who) });
			}
		}
		const failing = targets.filter((s) => (s.checks as SizeChecks).failed > 0);
		if (failing.length && !a.body.acknowledgeChecks) {
			const lines = failing.map((s) => `${s.name}: ${(s.checks as SizeChecks).list.filter((c) => !c.passed).map((c) => c.message).join('; ')}`);
			throw new ApiError(422, 'checks_not_acknowledged', `${failing.map((s) => s.name).join(', ')} ${failing.length === 1 ? 'has' : 'have'} checks that did not pass: read them, then sign off with acknowledgeChecks.`, { sizes: lines });
		}
		return sizeSetSizesSignOff(tx, targets.map((s) => s.id), a.userId, a.body.comment);
	});
}
