import type { MigrationContext } from '../migrate';

/**
 * Names that must be unique in a garden (beds; varieties of a crop) compare by Unicode 14 weights
 * (UCA 14.0.0, MariaDB ≥ 10.10): utf8mb4_unicode_ci (UCA 4.0) gave every emoji the same weight,
 * so "🍅 bed" and "🥕 bed" clashed. Still case- and accent-insensitive, as growers type names.
 */
const COLUMNS = [
  { table: 'beds', column: 'name', length: 80 },
  { table: 'varieties', column: 'name', length: 100 },
];

export async function up({ sequelize }: MigrationContext) {
  for (const c of COLUMNS) {
    await sequelize.query(`ALTER TABLE ${c.table} MODIFY ${c.column} VARCHAR(${c.length}) CHARACTER SET utf8mb4 COLLATE utf8mb4_uca1400_ai_ci NOT NULL`);
  }
}

export async function down({ sequelize }: MigrationContext) {
  for (const c of COLUMNS) {
    await sequelize.query(`ALTER TABLE ${c.table} MODIFY ${c.column} VARCHAR(${c.length}) CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci NOT NULL`);
  }
}
