import { DataTypes } from 'sequelize';
import type { MigrationContext } from '../migrate';

/** Moves whenever a garden's alerts may have changed (an evaluation, an acknowledgement): cached reads key on it. */
export async function up({ queryInterface: qi }: MigrationContext) {
  await qi.addColumn('alert_evaluations', 'revision', { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 });
}

export async function down({ queryInterface: qi }: MigrationContext) {
  await qi.removeColumn('alert_evaluations', 'revision');
}
