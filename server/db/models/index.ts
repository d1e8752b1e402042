import type { Sequelize } from 'sequelize';
import { User } from './user';
import { Garden } from './garden';
import { Membership } from './membership';
import { Session } from './session';
import { Bed } from './bed';
import { CropOverride } from './crop-override';
import { Variety } from './variety';
import { SeedLot } from './seed-lot';
import { GerminationTest } from './germination-test';
import { Planting } from './planting';
import { PlantingLog } from './planting-log';
import { PlantingPhoto } from './planting-photo';
import { initGardenRecordModels } from './garden-records';

export { User, Garden, Membership, Session };
export { Bed, CropOverride, Variety, SeedLot, GerminationTest, Planting, PlantingLog, PlantingPhoto };

let initialised: Sequelize | null = null;

/** Binds the model classes to one Sequelize instance (one per process; tests may rebind). */
export function initModels(sequelize: Sequelize) {
  if (initialised === sequelize) return;
  User.initModel(sequelize);
  Garden.initModel(sequelize);
  Membership.initModel(sequelize);
  Session.initModel(sequelize);
  Membership.belongsTo(User, { foreignKey: 'userId', as: 'user' });
  Membership.belongsTo(Garden, { foreignKey: 'gardenId', as: 'garden' });
  Garden.hasMany(Membership, { foreignKey: 'gardenId', as: 'memberships' });
  User.hasMany(Membership, { foreignKey: 'userId', as: 'memberships' });
  initGardenRecordModels(sequelize);
  initialised = sequelize;
}
