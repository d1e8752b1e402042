import { DataTypes, Model } from 'sequelize';
import type { CreationOptional, InferAttributes, InferCreationAttributes, NonAttribute, Sequelize } from 'sequelize';
import type { HarvestUnit, LogKind } from '#shared/schemas/plantings';
import type { User } from './user';

export class PlantingLog extends Model<InferAttributes<PlantingLog>, InferCreationAttributes<PlantingLog>> {
  declare id: CreationOptional<number>;
  declare gardenId: number;
  declare plantingId: number;
  declare entryOn: string;
  declare kind: LogKind;
  declare amount: number | null;
  declare amountUnit: HarvestUnit | null;
  declare note: string;
  declare photoId: number | null;
  declare createdBy: number | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare author?: NonAttribute<User | null>;

  static initModel(sequelize: Sequelize) {
    PlantingLog.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        gardenId: { type: DataTypes.INTEGER, allowNull: false },
        plantingId: { type: DataTypes.INTEGER, allowNull: false },
        entryOn: { type: DataTypes.DATEONLY, allowNull: false },
        kind: { type: DataTypes.ENUM('watered', 'fed', 'thinned', 'observation', 'harvest', 'bolted', 'photo'), allowNull: false },
        amount: { type: DataTypes.DOUBLE, allowNull: true },
        amountUnit: { type: DataTypes.ENUM('kg', 'g', 'lb', 'count', 'bunches'), allowNull: true },
        note: { type: DataTypes.STRING(1000), allowNull: false, defaultValue: '' },
        photoId: { type: DataTypes.INTEGER, allowNull: true },
        createdBy: { type: DataTypes.INTEGER, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'planting_logs', modelName: 'PlantingLog' },
    );
  }
}
