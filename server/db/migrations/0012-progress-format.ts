import { DataTypes } from 'sequelize';
import type { MigrationContext } from '../migrate';

/** The shape a cached answer was stored in: a row of an older shape is recomputed, not served. */
export async function up({ queryInterface: qi }: MigrationContext) {
  await qi.addColumn('planting_progress', 'format', { type: DataTypes.SMALLINT, allowNull: false, defaultValue: 0 });
}

export async function down({ queryInterface: qi }: MigrationContext) {
  await qi.removeColumn('planting_progress', 'format');
}
