import path from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { Umzug, SequelizeStorage } from 'umzug';
import type { QueryInterface, Sequelize } from 'sequelize';

const here = path.dirname(fileURLToPath(import.meta.url));

export interface MigrationContext {
  queryInterface: QueryInterface;
  sequelize: Sequelize;
}

export function createMigrator(sequelize: Sequelize) {
  return new Umzug<MigrationContext>({
    migrations: {
      glob: ['migrations/*.ts', { cwd: here }],
      resolve: ({ name, path: file, context }) => {
        const load = () => import(pathToFileURL(file!).href) as Promise<{ up: (c: MigrationContext) => Promise<void>; down: (c: MigrationContext) => Promise<void> }>;
        return {
          name: name.replace(/\.ts$/, ''),
          up: async () => (await load()).up(context),
          down: async () => (await load()).down(context),
        };
      },
    },
    context: { queryInterface: sequelize.getQueryInterface(), sequelize },
    storage: new SequelizeStorage({ sequelize, tableName: 'schema_migrations' }),
    logger: undefined,
  });
}

/** Applies pending migrations; several processes starting at once serialise on a named lock. */
export async function migrate(sequelize: Sequelize): Promise<string[]> {
  const [[row]] = (await sequelize.query("SELECT GET_LOCK('heatclock_migrate', 60) AS ok")) as [Array<{ ok: number }>, unknown];
  if (!row || Number(row.ok) !== 1) throw new Error('Could not take the migration lock within 60 s');
  try {
    const done = await createMigrator(sequelize).up();
    return done.map((m) => m.name);
  } finally {
    await sequelize.query("SELECT RELEASE_LOCK('heatclock_migrate')");
  }
}
