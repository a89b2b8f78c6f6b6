import { localeFromAcceptLanguage, TIME_ZONE_COOKIE, timeZoneOrUtc } from '$lib/format/date';
import { db } from '$lib/server/db';
import { membershipsForUser } from '$lib/server/repositories/memberships';
import type { LayoutServerLoad } from './$types';

export const load: LayoutServerLoad = async ({ locals, request, cookies }) => {
	const user = locals.user;
	return {
		user,
		memberships: user ? await membershipsForUser(db(), user.id) : [],
		// how dates read (src/lib/format/date.ts): the same on the server-rendered page and in the browser
		dates: {
			locale: localeFromAcceptLanguage(request.headers.get('accept-language')),
			timeZone: timeZoneOrUtc(cookies.get(TIME_ZONE_COOKIE))
		}
	};
};
