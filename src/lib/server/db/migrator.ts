import { promises as fs } from 'node:fs';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import { Migrator, type Kysely, type Migration, type MigrationProvider, type MigrationResultSet } from 'kysely';

/** Loads the plain-JS migrations of `migrations/` (name order = date order). */
class FolderMigrationProvider implements MigrationProvider {
	constructor(private readonly folder: string) {}
	async getMigrations(): Promise<Record<string, Migration>> {
		const files = (await fs.readdir(this.folder)).filter((f) => f.endsWith('.js')).sort();
		const out: Record<string, Migration> = {};
		for (const f of files) {
			out[f.replace(/\.js$/, '')] = (await import(
				/* @vite-ignore */ pathToFileURL(path.join(this.folder, f)).href
			)) as Migration;
		}
		return out;
	}
}

export function migrationsFolder(root = process.cwd()): string {
	return path.join(root, 'migrations');
}

function migrator(db: Kysely<any>, folder: string): Migrator {
	return new Migrator({ db, provider: new FolderMigrationProvider(folder), allowUnorderedMigrations: true });
}

function unwrap(set: MigrationResultSet): string[] {
	if (set.error) throw set.error instanceof Error ? set.error : new Error(String(set.error));
	return (set.results ?? []).map((r) => `${r.direction} ${r.migrationName}: ${r.status}`);
}

export async function migrateToLatest(db: Kysely<any>, folder = migrationsFolder()): Promise<string[]> {
	return unwrap(await migrator(db, folder).migrateToLatest());
}

export async function migrateDownAll(db: Kysely<any>, folder = migrationsFolder()): Promise<string[]> {
	const { NO_MIGRATIONS } = await import('kysely');
	return unwrap(await migrator(db, folder).migrateTo(NO_MIGRATIONS));
}
