import { DataTypes, Model } from 'sequelize';
import type { CreationOptional, InferAttributes, InferCreationAttributes, NonAttribute, Sequelize } from 'sequelize';
import type { SeedQuantityUnit } from '#shared/schemas/seed-lots';
import type { Variety } from './variety';

export class SeedLot extends Model<InferAttributes<SeedLot>, InferCreationAttributes<SeedLot>> {
  declare id: CreationOptional<number>;
  declare gardenId: number;
  declare varietyId: number;
  declare supplier: string;
  declare lotNumber: string;
  declare packedForYear: number | null;
  declare quantity: number | null;
  declare quantityUnit: SeedQuantityUnit;
  declare storageNotes: string;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare variety?: NonAttribute<Variety>;

  static initModel(sequelize: Sequelize) {
    SeedLot.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        gardenId: { type: DataTypes.INTEGER, allowNull: false },
        varietyId: { type: DataTypes.INTEGER, allowNull: false },
        supplier: { type: DataTypes.STRING(120), allowNull: false, defaultValue: '' },
        lotNumber: { type: DataTypes.STRING(60), allowNull: false, defaultValue: '' },
        packedForYear: { type: DataTypes.SMALLINT, allowNull: true },
        quantity: { type: DataTypes.DOUBLE, allowNull: true },
        quantityUnit: { type: DataTypes.ENUM('seeds', 'grams'), allowNull: false, defaultValue: 'seeds' },
        storageNotes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'seed_lots', modelName: 'SeedLot' },
    );
  }
}
