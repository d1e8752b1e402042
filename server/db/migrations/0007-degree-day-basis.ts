import { DataTypes } from 'sequelize';
import type { MigrationContext } from '../migrate';

/**
 * Every stored degree-day figure keeps the method it was counted with, so a figure measured at
 * one base is not reused at another. Doubles, not DECIMAL(4,1): a library base such as 40 °F is
 * 4.444… °C, and a rounded copy would no longer match the crop's method. Existing rows stay NULL,
 * which the app reads as "measured with the crop's library default method" (shared/crops/basis.ts):
 * a garden's own method lives in its overrides and cannot be worked out here without app code.
 * The method lists are written out so this migration never changes with the app's.
 */
const METHODS = ['average', 'clamped-average', 'single-sine', 'single-triangle', 'double-sine', 'double-triangle'];
const CUTOFFS = ['horizontal', 'vertical', 'intermediate'];

const basisColumns = (prefix: string) => ({
  [`${prefix}_base_c`]: { type: DataTypes.DOUBLE, allowNull: true },
  [`${prefix}_upper_c`]: { type: DataTypes.DOUBLE, allowNull: true },
  [`${prefix}_method`]: { type: DataTypes.ENUM(...METHODS), allowNull: true },
  [`${prefix}_cutoff`]: { type: DataTypes.ENUM(...CUTOFFS), allowNull: true },
});

const TABLES = [
  { table: 'varieties', prefix: 'gdd_target' },
  { table: 'crop_overrides', prefix: 'dd' },
];

export async function up({ queryInterface: qi }: MigrationContext) {
  for (const { table, prefix } of TABLES) {
    for (const [column, spec] of Object.entries(basisColumns(prefix))) await qi.addColumn(table, column, spec);
  }
}

export async function down({ queryInterface: qi }: MigrationContext) {
  for (const { table, prefix } of TABLES) {
    for (const column of Object.keys(basisColumns(prefix))) await qi.removeColumn(table, column);
  }
}
