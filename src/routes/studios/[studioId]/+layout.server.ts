import { error } from '@sveltejs/kit';
import { ALL_ROLES, requireRole, roleCan } from '$lib/server/authz';
import { studioPlan } from '$lib/server/billing/plan';
import { db } from '$lib/server/db';
import { studiosById } from '$lib/server/repositories/studios';
import type { LayoutServerLoad } from './$types';

export const load: LayoutServerLoad = async (event) => {
	const { studioId, role } = await requireRole(event, ALL_ROLES);
	const studio = await studiosById(db(), studioId);
	if (!studio) error(404, { message: 'No such studio.', code: 'not_found' });
	const plan = await studioPlan(db(), studioId);
	// what the member may do, decided once here from the authorization table: pages read `data.can`
	return {
		studio: { id: studio.id, name: studio.name },
		role,
		can: roleCan(role),
		// for the banner: a failed payment, or limits a lapsed plan leaves the studio past
		billingNotice: {
			plan: plan.state.plan,
			paymentFailed: plan.billing?.payment_failed_at != null && plan.billing.status === 'past_due',
			exceeded: plan.exceeded
		}
	};
};
