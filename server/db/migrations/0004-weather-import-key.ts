import type { MigrationContext } from '../migrate';

/** One import per garden and file: two simultaneous uploads of the same file cannot both land. */
export async function up({ queryInterface: qi }: MigrationContext) {
  await qi.addIndex('weather_imports', ['garden_id', 'sha256'], { unique: true, name: 'weather_imports_garden_file' });
}

export async function down({ queryInterface: qi }: MigrationContext) {
  await qi.removeIndex('weather_imports', 'weather_imports_garden_file');
}
