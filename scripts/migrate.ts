// Applies the migrations in migrations/ to DATABASE_URL. Run by the start and test scripts.
import { dbCreate } from '../src/lib/server/db/index';
import { migrateToLatest } from '../src/lib/server/db/migrator';

const db = dbCreate(undefined, 1);
try {
	const done = await migrateToLatest(db);
	console.log(done.length ? done.join('\n') : '[dartelier] migrations: up to date');
} finally {
	await db.destroy();
}
