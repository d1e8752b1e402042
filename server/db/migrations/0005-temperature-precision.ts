import type { MigrationContext } from '../migrate';

/**
 * °F readings converted to °C have no short decimal form (24 °F is −4.444… °C): rounded to 0.1 °C
 * they crossed freeze thresholds and came back as a different °F. DOUBLE keeps what was measured.
 */
const TABLES = ['weather_days', 'garden_weather_days'];

export async function up({ sequelize }: MigrationContext) {
  for (const table of TABLES) {
    await sequelize.query(`ALTER TABLE ${table} MODIFY tmax_c DOUBLE NOT NULL, MODIFY tmin_c DOUBLE NOT NULL`);
  }
}

export async function down({ sequelize }: MigrationContext) {
  for (const table of TABLES) {
    await sequelize.query(`ALTER TABLE ${table} MODIFY tmax_c DECIMAL(4,1) NOT NULL, MODIFY tmin_c DECIMAL(4,1) NOT NULL`);
  }
}
