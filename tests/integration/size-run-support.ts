// Shared set-up of the size-run and size-set tests: a studio on the Studio plan (the Sketch plan allows
// 3 sizes and 3 seats) with one member per role asked for, each signed in, and the studio's sets of the
// ASTM D5585-11e1 chart (reference-values row 1, C) by chart key.
import type { Role } from '../../src/lib/server/db/schema';
import { measurementChartsEnsure } from '../../src/lib/server/measurements/charts';
import { measurementSetsOfStudio } from '../../src/lib/server/repositories/measurement-sets';
import { memberAdd, sessionClient, studioMake, studioOnStudioPlan, testDb, userMake, type Client } from './helpers';

export interface SizeRunWorld<R extends Role> {
	studioId: string;
	/** each member's user id */
	users: Record<R, string>;
	/** each member's signed-in client */
	as: Record<R, Client>;
	/** the studio's chart sets: chart key (e.g. `astm-d5585/curvy/12`) → measurement set id */
	sets: Map<string, string>;
}

export async function sizeRunWorld<R extends Role>(baseUrl: string, label: string, roles: readonly R[]): Promise<SizeRunWorld<R>> {
	const studioId = (await studioMake(label)).id;
	await studioOnStudioPlan(studioId);
	const users = {} as Record<R, string>;
	const as = {} as Record<R, Client>;
	for (const role of roles) {
		users[role] = (await userMake(role)).id;
		await memberAdd(studioId, users[role], role);
		as[role] = await sessionClient(baseUrl, users[role]);
	}
	await measurementChartsEnsure(testDb(), studioId);
	const sets = new Map<string, string>();
	for (const s of await measurementSetsOfStudio(testDb(), studioId)) if (s.chartKey) sets.set(s.chartKey, s.id);
	return { studioId, users, as, sets };
}
