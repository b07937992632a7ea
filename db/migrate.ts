// Runs the migrations in migrations/ with Kysely's Migrator. The provider imports each file from
// project code (not from inside node_modules), so it works under tsx and vitest alike.
import { promises as fs } from 'node:fs';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import { type Kysely, type Migration, type MigrationProvider, type MigrationResultSet, Migrator } from 'kysely';

const MIGRATIONS_DIR = path.resolve(__dirname, '..', 'migrations');

class ProjectMigrationProvider implements MigrationProvider {
  async getMigrations(): Promise<Record<string, Migration>> {
    const files = (await fs.readdir(MIGRATIONS_DIR)).filter((f) => /^\d{4}_\d{2}_\d{2}_\d{4}_[a-z0-9_]+\.ts$/.test(f)).sort();
    const out: Record<string, Migration> = {};
    for (const f of files) {
      out[f.replace(/\.ts$/, '')] = (await import(pathToFileURL(path.join(MIGRATIONS_DIR, f)).href)) as Migration;
    }
    return out;
  }
}

export async function migrateToLatest(db: Kysely<any>): Promise<MigrationResultSet> {
  const migrator = new Migrator({ db, provider: new ProjectMigrationProvider() });
  return migrator.migrateToLatest();
}
