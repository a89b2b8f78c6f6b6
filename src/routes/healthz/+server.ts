import { requireRole } from '$lib/server/authz';
import type { RequestHandler } from './$types';

/** The process is up and answering (for a load balancer's liveness probe): nothing else is checked. */
export const GET: RequestHandler = async (event) => {
	await requireRole(event, 'public');
	return new Response(JSON.stringify({ status: 'up' }), {
		status: 200,
		headers: { 'content-type': 'application/json', 'cache-control': 'no-store' }
	});
};
