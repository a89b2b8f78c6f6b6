import { error, redirect, type RequestEvent } from '@sveltejs/kit';
import { db } from './db';
import { ROLES, roleLabel, type Can, type Role } from '../roles';
import { membershipsRole } from './repositories/memberships';
import { uuidSchema } from './validation';

/**
 * Who may do what, in one table: SvelteKit route id → HTTP method → rule.
 *   'public'     anyone, signed in or not
 *   'signed_in'  any signed-in user
 *   Role[]       signed-in members of the route's studio ([studioId] param) with one of these roles
 *
 * Default deny. `hooks.server.ts` checks every request against this table before the route runs:
 *   - a route id with no row → 403 (and an error in the log: every route needs a row);
 *   - a method with no entry → 405 with an Allow header (HEAD counts as GET);
 *   - signed out on a rule other than 'public' → 401 on /api, otherwise 303 to /signin?next=…;
 *   - not a member of the studio (or no such studio, or a malformed id) → 404, never 403, so another
 *     studio's resources look exactly like missing ones;
 *   - a member whose role is not listed → 403.
 * Every form action, load and +server.ts handler checks again with `requireRole(event, rule)`.
 * Page routes: GET = page load, POST = form actions. Add a row with each new route (the integration
 * authorization matrix fails for a route file without one).
 */
export type Rule = 'public' | 'signed_in' | readonly Role[];
export type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';

export const ALL_ROLES = ROLES;
export const OWNER = ['owner'] as const satisfies readonly Role[];
/** Write pieces and versions. */
export const EDITORS = ['owner', 'patterncutter'] as const satisfies readonly Role[];
/** Sign a version off (the state route lets EDITORS_AND_SIGNERS through; its handler asks for these). */
export const SIGNERS = ['owner', 'designer'] as const satisfies readonly Role[];
/** Propose (editors) or sign off (owner, designer): the handler checks which. */
export const EDITORS_AND_SIGNERS = ['owner', 'patterncutter', 'designer'] as const satisfies readonly Role[];
/** See versions that are not signed off; the sample room sees signed-off versions only (handlers filter). */
export const DRAFT_READERS = ['owner', 'patterncutter', 'designer'] as const satisfies readonly Role[];
/** Record fittings of a toile and upload their photos (the sample room fits; the owner may too). */
export const FITTERS = ['owner', 'sampleroom'] as const satisfies readonly Role[];
/** Pin fit notes on the pattern: whoever was at the fitting or reads it (the sample room pins what it saw). */
export const NOTE_WRITERS = ['owner', 'patterncutter', 'designer', 'sampleroom'] as const satisfies readonly Role[];
/** Mark a fit note done, resolved by a version: only whoever makes the versions. */
export const NOTE_RESOLVERS = ['owner', 'patterncutter'] as const satisfies readonly Role[];
/** Start and cancel a size run (a style's recipe replayed on other measurement sets): whoever makes the versions. */
export const SIZE_RUNNERS = ['owner', 'patterncutter'] as const satisfies readonly Role[];
/** Sign sizes of a size set off: the signers of versions (a pattern cutter keeps a run, a designer or owner signs its sizes off). */
export const SIZE_SET_SIGNERS = SIGNERS;
/** Write in a version's comment thread. */
export const COMMENTERS = ['owner', 'patterncutter', 'designer'] as const satisfies readonly Role[];

export const AUTHZ: Record<string, Partial<Record<Method, Rule>>> = {
	// pages
	'/': { GET: 'public' },
	// health probes of a load balancer (README "Operating it")
	'/healthz': { GET: 'public' },
	'/readyz': { GET: 'public' },
	'/(auth)/signup': { GET: 'public', POST: 'public' },
	'/(auth)/signin': { GET: 'public', POST: 'public' },
	'/(auth)/signout': { GET: 'public', POST: 'public' },
	'/(auth)/reset': { GET: 'public', POST: 'public' },
	'/(auth)/reset/[token]': { GET: 'public', POST: 'public' },
	'/(auth)/invite/[token]': { GET: 'public', POST: 'public' },
	'/studios/new': { GET: 'signed_in', POST: 'signed_in' },
	'/studios/[studioId]': { GET: ALL_ROLES },
	'/studios/[studioId]/members': { GET: ALL_ROLES },
	'/studios/[studioId]/styles/[styleId]': { GET: ALL_ROLES },
	'/studios/[studioId]/styles/[styleId]/compare': { GET: ALL_ROLES },
	'/studios/[studioId]/styles/[styleId]/pieces/[pieceId]/versions/[versionId]': { GET: ALL_ROLES },
	'/studios/[studioId]/styles/[styleId]/edit': { GET: ALL_ROLES },
	'/studios/[studioId]/styles/[styleId]/print': { GET: ALL_ROLES },
	'/studios/[studioId]/styles/[styleId]/cutting-list': { GET: ALL_ROLES },
	'/studios/[studioId]/styles/[styleId]/import': { GET: EDITORS },
	'/studios/[studioId]/fittings/[fittingId]': { GET: ALL_ROLES },
	'/studios/[studioId]/styles/[styleId]/size-runs': { GET: DRAFT_READERS },
	'/studios/[studioId]/size-runs/[sizeRunId]': { GET: DRAFT_READERS },
	// a size set: everyone in the studio (the sample room: once a size is signed off; the load filters)
	'/studios/[studioId]/size-sets/[sizeSetId]': { GET: ALL_ROLES },
	'/settings/notifications': { GET: 'signed_in', POST: 'signed_in' },
	'/settings/account': { GET: 'signed_in', POST: 'signed_in' },
	// measurement sets (editors create, edit and draft; everyone in the studio views)
	'/studios/[studioId]/measurements': { GET: ALL_ROLES },
	'/studios/[studioId]/measurements/new': { GET: EDITORS, POST: EDITORS },
	'/studios/[studioId]/measurements/compare': { GET: ALL_ROLES },
	'/studios/[studioId]/measurements/[setId]': { GET: ALL_ROLES, POST: EDITORS },
	'/studios/[studioId]/measurements/[setId]/edit': { GET: EDITORS, POST: EDITORS },
	'/studios/[studioId]/styles/new': { GET: EDITORS, POST: EDITORS },
	// billing: the plan, seats and invoices are the owners' business
	'/studios/[studioId]/billing': { GET: OWNER },
	// JSON API
	'/api/me': { GET: 'signed_in', DELETE: 'signed_in' },
	'/api/me/export': { GET: 'signed_in' },
	'/api/me/notifications': { GET: 'signed_in', PATCH: 'signed_in' },
	'/api/studios': { GET: 'signed_in', POST: 'signed_in' },
	'/api/studios/[studioId]': { GET: ALL_ROLES, PATCH: OWNER },
	'/api/studios/[studioId]/members': { GET: ALL_ROLES },
	'/api/studios/[studioId]/members/[userId]': { PATCH: OWNER, DELETE: OWNER },
	'/api/studios/[studioId]/invitations': { GET: OWNER, POST: OWNER },
	'/api/studios/[studioId]/invitations/[invitationId]': { DELETE: OWNER },
	// any member leaves a studio themselves (its last owner cannot: 409)
	'/api/studios/[studioId]/membership': { DELETE: ALL_ROLES },
	'/api/studios/[studioId]/billing': { GET: OWNER },
	'/api/studios/[studioId]/billing/checkout': { POST: OWNER },
	'/api/studios/[studioId]/billing/portal': { POST: OWNER },
	'/api/studios/[studioId]/billing/subscription': { PATCH: OWNER },
	// the payment provider's events: anyone may post, only a body signed with the webhook secret is read
	'/api/billing/webhook': { POST: 'public' },
	// styles, pieces, versions (the sample room sees signed-off versions only; handlers filter)
	'/api/studios/[studioId]/styles': { GET: ALL_ROLES, POST: EDITORS },
	'/api/studios/[studioId]/styles/[styleId]': { GET: ALL_ROLES, PATCH: EDITORS },
	'/api/studios/[studioId]/styles/[styleId]/pieces': { POST: EDITORS },
	'/api/studios/[studioId]/styles/[styleId]/changes': { POST: EDITORS },
	'/api/studios/[studioId]/styles/[styleId]/seam-pairs': { GET: ALL_ROLES, POST: EDITORS },
	'/api/studios/[studioId]/styles/[styleId]/seam-pairs/[seamPairId]': { PATCH: EDITORS, DELETE: EDITORS },
	'/api/studios/[studioId]/styles/[styleId]/export.svg': { GET: ALL_ROLES },
	'/api/studios/[studioId]/styles/[styleId]/export.pdf': { GET: ALL_ROLES },
	'/api/studios/[studioId]/styles/[styleId]/export.dxf': { GET: ALL_ROLES },
	'/api/studios/[studioId]/styles/[styleId]/cutting-list': { GET: ALL_ROLES },
	'/api/studios/[studioId]/styles/[styleId]/cutting-list.csv': { GET: ALL_ROLES },
	'/api/studios/[studioId]/styles/[styleId]/imports': { POST: EDITORS },
	// size runs: started and cancelled by pattern cutters and owners, read by whoever sees drafts
	'/api/studios/[studioId]/styles/[styleId]/size-runs': { GET: DRAFT_READERS, POST: SIZE_RUNNERS },
	'/api/studios/[studioId]/size-runs/[sizeRunId]': { GET: DRAFT_READERS, DELETE: SIZE_RUNNERS },
	// size sets (a run's results kept): kept by whoever starts runs, signed off per size by the signers;
	// the sample room sees signed-off sizes only (handlers filter)
	'/api/studios/[studioId]/size-runs/[sizeRunId]/keep': { POST: SIZE_RUNNERS },
	'/api/studios/[studioId]/styles/[styleId]/size-sets': { GET: ALL_ROLES },
	'/api/studios/[studioId]/size-sets/[sizeSetId]': { GET: ALL_ROLES },
	'/api/studios/[studioId]/size-sets/[sizeSetId]/sign-off': { POST: SIZE_SET_SIGNERS },
	'/api/studios/[studioId]/size-sets/[sizeSetId]/export.svg': { GET: ALL_ROLES },
	'/api/studios/[studioId]/size-sets/[sizeSetId]/export.pdf': { GET: ALL_ROLES },
	'/api/studios/[studioId]/size-sets/[sizeSetId]/export.dxf': { GET: ALL_ROLES },
	'/api/studios/[studioId]/pieces/[pieceId]': { GET: ALL_ROLES },
	'/api/studios/[studioId]/pieces/[pieceId]/versions': { GET: ALL_ROLES, POST: EDITORS },
	'/api/studios/[studioId]/pieces/[pieceId]/versions/[versionId]': { GET: ALL_ROLES },
	'/api/studios/[studioId]/pieces/[pieceId]/versions/[versionId]/state': { POST: EDITORS_AND_SIGNERS },
	'/api/studios/[studioId]/pieces/[pieceId]/versions/[versionId]/review': { GET: ALL_ROLES },
	'/api/studios/[studioId]/pieces/[pieceId]/versions/[versionId]/comments': { GET: ALL_ROLES, POST: COMMENTERS },
	'/api/studios/[studioId]/pieces/[pieceId]/fit-notes': { GET: ALL_ROLES },
	'/api/studios/[studioId]/pieces/[pieceId]/compare': { GET: ALL_ROLES },
	'/api/studios/[studioId]/pieces/[pieceId]/export.svg': { GET: ALL_ROLES },
	// fittings of a toile: photos, fit notes pinned to the pattern
	'/api/studios/[studioId]/styles/[styleId]/fittings': { GET: ALL_ROLES, POST: FITTERS },
	'/api/studios/[studioId]/fittings/[fittingId]': { GET: ALL_ROLES, DELETE: FITTERS },
	'/api/studios/[studioId]/fittings/[fittingId]/photos': { POST: FITTERS },
	'/api/studios/[studioId]/fittings/[fittingId]/photos/[photoId]': { DELETE: FITTERS },
	'/api/studios/[studioId]/fittings/[fittingId]/notes': { POST: NOTE_WRITERS },
	'/api/studios/[studioId]/fittings/[fittingId]/notes/[noteId]': { PATCH: NOTE_WRITERS },
	'/api/studios/[studioId]/fittings/[fittingId]/notes/[noteId]/done': { POST: NOTE_RESOLVERS },
	'/api/studios/[studioId]/measurement-sets': { GET: ALL_ROLES, POST: EDITORS },
	'/api/studios/[studioId]/measurement-sets/[setId]': { GET: ALL_ROLES, PATCH: EDITORS, DELETE: EDITORS },
	'/api/studios/[studioId]/measurement-sets/[setId]/duplicate': { POST: EDITORS }
};

/** Does the table let a member with this role make this request (route id and method)? */
export function roleMay(role: Role, routeId: string, method: Method): boolean {
	const rule = AUTHZ[routeId]?.[method];
	if (rule === undefined) return false;
	return rule === 'public' || rule === 'signed_in' || rule.includes(role);
}

/** What a member with this role may do, read from the table above: pages get it as `data.can`. */
export function roleCan(role: Role): Can {
	const studio = '/api/studios/[studioId]';
	return {
		edit: roleMay(role, `${studio}/pieces/[pieceId]/versions`, 'POST'),
		propose: (EDITORS as readonly Role[]).includes(role) && roleMay(role, `${studio}/pieces/[pieceId]/versions/[versionId]/state`, 'POST'),
		signOff: (SIGNERS as readonly Role[]).includes(role) && roleMay(role, `${studio}/pieces/[pieceId]/versions/[versionId]/state`, 'POST'),
		seeDrafts: (DRAFT_READERS as readonly Role[]).includes(role),
		createStyles: roleMay(role, '/studios/[studioId]/styles/new', 'POST') && roleMay(role, `${studio}/styles`, 'POST'),
		editMeasurements: roleMay(role, `${studio}/measurement-sets`, 'POST'),
		manageMembers: roleMay(role, `${studio}/members/[userId]`, 'PATCH'),
		invite: roleMay(role, `${studio}/invitations`, 'POST'),
		manageStudio: roleMay(role, studio, 'PATCH'),
		manageBilling: roleMay(role, `${studio}/billing`, 'GET') && roleMay(role, '/studios/[studioId]/billing', 'GET'),
		recordFittings: roleMay(role, `${studio}/styles/[styleId]/fittings`, 'POST'),
		pinNotes: roleMay(role, `${studio}/fittings/[fittingId]/notes`, 'POST'),
		resolveNotes: roleMay(role, `${studio}/fittings/[fittingId]/notes/[noteId]/done`, 'POST'),
		comment: roleMay(role, `${studio}/pieces/[pieceId]/versions/[versionId]/comments`, 'POST'),
		runSizes: roleMay(role, `${studio}/styles/[styleId]/size-runs`, 'POST'),
		keepSizeSets: roleMay(role, `${studio}/size-runs/[sizeRunId]/keep`, 'POST'),
		signOffSizes: roleMay(role, `${studio}/size-sets/[sizeSetId]/sign-off`, 'POST')
	};
}

export type Lookup =
	| { kind: 'rule'; rule: Rule }
	| { kind: 'no_route' }
	| { kind: 'no_method'; allow: string[] };

export function ruleLookup(routeId: string, method: string): Lookup {
	const row = AUTHZ[routeId];
	if (!row) return { kind: 'no_route' };
	const m = (method === 'HEAD' ? 'GET' : method) as Method;
	const rule = row[m];
	if (rule) return { kind: 'rule', rule };
	const allow = Object.keys(row);
	if (allow.includes('GET')) allow.push('HEAD');
	return { kind: 'no_method', allow };
}

type Event = Pick<RequestEvent, 'locals' | 'params' | 'route' | 'url'>;
type SignedIn = { user: NonNullable<App.Locals['user']> };
export type Granted<R extends Rule> = R extends 'public'
	? { user: App.Locals['user'] }
	: R extends 'signed_in'
		? SignedIn
		: SignedIn & { studioId: string; role: Role };

export type Decision =
	| { ok: true; user: App.Locals['user']; studioId?: string; role?: Role }
	| { ok: false; status: 401 | 403 | 404; message: string };

// One membership lookup per request, shared by the hook and the route's own check.
const roleCache = new WeakMap<App.Locals, Map<string, Promise<Role | undefined>>>();

function roleOf(locals: App.Locals, studioId: string, userId: string): Promise<Role | undefined> {
	let m = roleCache.get(locals);
	if (!m) roleCache.set(locals, (m = new Map()));
	let p = m.get(`${studioId}:${userId}`);
	if (!p) {
		// the roles read with the session (the same request's snapshot) spare a round trip
		const known = locals.roles?.userId === userId ? locals.roles.byStudio : undefined;
		p = known ? Promise.resolve(Object.hasOwn(known, studioId) ? known[studioId] : undefined) : membershipsRole(db(), studioId, userId);
		m.set(`${studioId}:${userId}`, p);
	}
	return p;
}

/** The decision itself, without side effects; used by the hook and by `requireRole`. */
export async function decide(event: Event, rule: Rule): Promise<Decision> {
	const user = event.locals.user;
	if (rule === 'public') return { ok: true, user };
	if (!user) return { ok: false, status: 401, message: 'Sign in first.' };
	if (rule === 'signed_in') return { ok: true, user };
	const raw = (event.params as Record<string, string | undefined>).studioId;
	if (raw === undefined) throw new Error(`authz: role rule on route ${event.route.id} without [studioId]`);
	const studioId = uuidSchema.safeParse(raw);
	if (!studioId.success) return { ok: false, status: 404, message: 'No such studio.' };
	const role = await roleOf(event.locals, studioId.data, user.id);
	if (!role) return { ok: false, status: 404, message: 'No such studio.' };
	if (!rule.includes(role)) {
		return { ok: false, status: 403, message: `Your role (${roleLabel(role)}) does not allow this in this studio.` };
	}
	return { ok: true, user, studioId: studioId.data, role };
}

export function signInPath(url: URL): string {
	return `/signin?next=${encodeURIComponent(url.pathname + url.search)}`;
}

/**
 * The check every load, form action and +server.ts handler makes. Throws SvelteKit's `error()`
 * (401/403/404; the API wrapper turns it into JSON) or, on pages, redirects a signed-out visitor to
 * the sign-in page.
 */
export async function requireRole<R extends Rule>(event: Event, rule: R): Promise<Granted<R>> {
	const d = await decide(event, rule);
	if (!d.ok) {
		if (d.status === 401 && !event.route.id?.startsWith('/api/')) redirect(303, signInPath(event.url));
		const code = d.status === 401 ? 'unauthenticated' : d.status === 403 ? 'forbidden' : 'not_found';
		error(d.status, { message: d.message, code });
	}
	return d as unknown as Granted<R>;
}
