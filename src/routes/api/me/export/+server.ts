import { apiRoute } from '$lib/server/api';
import { requireRole } from '$lib/server/authz';
import { db } from '$lib/server/db';
import { accountExport } from '$lib/server/repositories/account-export';
import type { RequestHandler } from './$types';

/** The signed-in person's own data as a JSON download (one consistent snapshot). */
export const GET: RequestHandler = apiRoute(async (event) => {
	const { user } = await requireRole(event, 'signed_in');
	const data = await db()
		.transaction()
		.setIsolationLevel('repeatable read')
		.execute((tx) => accountExport(tx, user.id));
	const exportedAt = new Date().toISOString();
	const body = JSON.stringify({ format: 'dartelier-account-export', version: 1, exportedAt, ...data }, null, 2);
	return new Response(body, {
		headers: {
			'content-type': 'application/json; charset=utf-8',
			'content-disposition': `attachment; filename="dartelier-my-data-${exportedAt.slice(0, 10)}.json"`,
			'cache-control': 'no-store'
		}
	});
});
