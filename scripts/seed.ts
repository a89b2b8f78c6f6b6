// Seeds the demo studio into DATABASE_URL (idempotent). Run by `npm start`.
import { dbCreate } from '../src/lib/server/db/index';
import { demoStudioSeed } from '../src/lib/server/seed/demo-studio';

const db = dbCreate(undefined, 2);
try {
	const r = await demoStudioSeed(db);
	console.log(`[dartelier] demo studio ${r.created ? 'seeded' : 'already there'} (${r.studioId})`);
	console.log(`[dartelier] demo plans: Studio with its seats paid (${r.studioId}), Sketch (${r.sketchStudioId})`);
} finally {
	await db.destroy();
}
