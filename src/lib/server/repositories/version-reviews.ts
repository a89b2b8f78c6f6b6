import type { DbOrTx } from '../db';
import { authorName } from './former-member';
import type { ReviewKind } from '../db/schema';

/** Something the signer saw and accepted when signing off: a seam out of tolerance, an open fit note. */
export interface Acknowledgement {
	kind: 'seam' | 'fit_note';
	id: string;
	message: string;
}

export interface VersionReviewRow {
	id: string;
	versionId: string;
	kind: ReviewKind;
	actorId: string | null;
	actorName: string | null;
	comment: string;
	acknowledged: Acknowledgement[];
	createdAt: Date;
}

export async function versionReviewsInsert(
	db: DbOrTx,
	r: { versionId: string; kind: ReviewKind; actorId: string; comment?: string; acknowledged?: Acknowledgement[] }
): Promise<void> {
	await db
		.insertInto('version_reviews')
		.values({
			version_id: r.versionId,
			kind: r.kind,
			actor_id: r.actorId,
			comment: r.comment ?? '',
			acknowledged: JSON.stringify(r.acknowledged ?? [])
		})
		.execute();
}

/** The version's review record, oldest first. */
export async function versionReviewsOf(db: DbOrTx, versionId: string): Promise<VersionReviewRow[]> {
	return db
		.selectFrom('version_reviews')
		.leftJoin('users', 'users.id', 'version_reviews.actor_id')
		.select([
			'version_reviews.id',
			'version_reviews.version_id as versionId',
			'version_reviews.kind',
			'version_reviews.actor_id as actorId',
			authorName('users.name', 'actorName'),
			'version_reviews.comment',
			'version_reviews.acknowledged',
			'version_reviews.created_at as createdAt'
		])
		.where('version_reviews.version_id', '=', versionId)
		.orderBy('version_reviews.created_at')
		.orderBy('version_reviews.id')
		.execute() as Promise<VersionReviewRow[]>;
}

/** Who proposed the version last (the one who may withdraw it besides its author). */
export async function versionReviewsLastProposer(db: DbOrTx, versionId: string): Promise<string | null> {
	const r = await db
		.selectFrom('version_reviews')
		.select('actor_id')
		.where('version_id', '=', versionId)
		.where('kind', '=', 'proposed')
		.orderBy('created_at', 'desc')
		.limit(1)
		.executeTakeFirst();
	return r?.actor_id ?? null;
}
