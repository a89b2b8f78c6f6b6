import type { DbOrTx } from '../db';
import { authorName } from './former-member';

export interface VersionCommentRow {
	id: string;
	versionId: string;
	authorId: string | null;
	authorName: string | null;
	body: string;
	createdAt: Date;
}

export async function versionCommentsInsert(db: DbOrTx, c: { versionId: string; authorId: string; body: string }): Promise<{ id: string }> {
	return db
		.insertInto('version_comments')
		.values({ version_id: c.versionId, author_id: c.authorId, body: c.body })
		.returning('id')
		.executeTakeFirstOrThrow();
}

/** The version's thread, oldest first. */
export async function versionCommentsOf(db: DbOrTx, versionId: string): Promise<VersionCommentRow[]> {
	return db
		.selectFrom('version_comments')
		.leftJoin('users', 'users.id', 'version_comments.author_id')
		.select([
			'version_comments.id',
			'version_comments.version_id as versionId',
			'version_comments.author_id as authorId',
			authorName('users.name', 'authorName'),
			'version_comments.body',
			'version_comments.created_at as createdAt'
		])
		.where('version_comments.version_id', '=', versionId)
		.orderBy('version_comments.created_at')
		.orderBy('version_comments.id')
		.execute();
}
