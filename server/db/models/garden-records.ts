import type { Sequelize } from 'sequelize';
import { User } from './user';
import { Bed } from './bed';
import { CropOverride } from './crop-override';
import { Variety } from './variety';
import { SeedLot } from './seed-lot';
import { GerminationTest } from './germination-test';
import { Planting } from './planting';
import { PlantingLog } from './planting-log';
import { PlantingPhoto } from './planting-photo';

/** Beds, crops, varieties, seed lots and plantings: the garden's own records. */
export function initGardenRecordModels(sequelize: Sequelize) {
  Bed.initModel(sequelize);
  CropOverride.initModel(sequelize);
  Variety.initModel(sequelize);
  SeedLot.initModel(sequelize);
  GerminationTest.initModel(sequelize);
  Planting.initModel(sequelize);
  PlantingLog.initModel(sequelize);
  PlantingPhoto.initModel(sequelize);
  SeedLot.belongsTo(Variety, { foreignKey: 'varietyId', as: 'variety' });
  Planting.belongsTo(Bed, { foreignKey: 'bedId', as: 'bed' });
  Planting.belongsTo(Variety, { foreignKey: 'varietyId', as: 'variety' });
  Planting.belongsTo(SeedLot, { foreignKey: 'seedLotId', as: 'seedLot' });
  PlantingLog.belongsTo(User, { foreignKey: 'createdBy', as: 'author' });
  PlantingPhoto.belongsTo(User, { foreignKey: 'createdBy', as: 'author' });
}
