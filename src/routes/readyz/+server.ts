import { readinessCheck } from '$lib/server/readiness';
import { requireRole } from '$lib/server/authz';
import type { RequestHandler } from './$types';

/**
 * Whether this process can serve requests now (for a load balancer's readiness probe): 200 when the
 * database, the object store and the size-run queue all answer, else 503 naming the parts that did not.
 */
export const GET: RequestHandler = async (event) => {
	await requireRole(event, 'public');
	const r = await readinessCheck();
	const body = r.ready ? { status: 'ready', checks: r.checks } : { status: 'unavailable', failed: r.failed, checks: r.checks };
	return new Response(JSON.stringify(body), {
		status: r.ready ? 200 : 503,
		headers: { 'content-type': 'application/json', 'cache-control': 'no-store' }
	});
};
