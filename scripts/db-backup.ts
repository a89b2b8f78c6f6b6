// npm run db:backup [-- DIR]       writes DIR/dartelier-<UTC date>/ (default DIR: backups/)
// npm run db:restore -- BACKUP     restores the backup folder (or its manifest.json) into an empty database and bucket
// Run through scripts/backup.sh, which gives PG_BIN (PostgreSQL's client programs) and, when the
// environment names no DATABASE_URL, the dev cluster's. The object store is the one S3_* names
// (src/lib/server/storage), by default the local one `npm start` runs.
import { backupRestore, backupWrite, RestoreRefused } from '../src/lib/server/backup/index';
import { databaseUrl, dbCreate } from '../src/lib/server/db/index';

const [action, arg] = process.argv.slice(2);
const pgBin = process.env.PG_BIN;
if (!pgBin) throw new Error('PG_BIN is not set: run through npm run db:backup / db:restore');
const db = dbCreate(databaseUrl(), 2);
let code = 0;
try {
	if (action === 'backup') {
		const dir = await backupWrite(db, databaseUrl(), pgBin, arg || 'backups');
		console.log(`[dartelier] backup written: ${dir}`);
	} else if (action === 'restore') {
		if (!arg) throw new RestoreRefused('name the backup folder: npm run db:restore -- backups/dartelier-…');
		const m = await backupRestore(db, databaseUrl(), pgBin, arg);
		const rows = Object.values(m.database.tables).reduce((a, b) => a + b, 0);
		console.log(
			`[dartelier] restored the backup of ${m.createdAt}: ${Object.keys(m.database.tables).length} tables, ${rows} rows, ${m.objectStore.objects.length} objects, every checksum verified`
		);
	} else {
		throw new RestoreRefused('usage: db-backup.ts backup [DIR] | restore BACKUP');
	}
} catch (e) {
	console.error(`[dartelier] ${e instanceof RestoreRefused ? e.message : (e as Error).stack}`);
	code = 1;
} finally {
	await db.destroy();
}
process.exit(code);
