import { DataTypes, Model } from 'sequelize';
import type { CreationOptional, InferAttributes, InferCreationAttributes, Sequelize } from 'sequelize';

/** One garden's own value for one crop parameter; value is JSON so numbers, words and yes/no fit one column. */
export class CropOverride extends Model<InferAttributes<CropOverride>, InferCreationAttributes<CropOverride>> {
  declare id: CreationOptional<number>;
  declare gardenId: number;
  declare cropKey: string;
  declare paramKey: string;
  declare valueJson: string;
  declare note: string;
  declare updatedBy: number | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    CropOverride.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        gardenId: { type: DataTypes.INTEGER, allowNull: false },
        cropKey: { type: DataTypes.STRING(40), allowNull: false },
        paramKey: { type: DataTypes.STRING(40), allowNull: false },
        valueJson: { type: DataTypes.STRING(100), allowNull: false },
        note: { type: DataTypes.STRING(300), allowNull: false, defaultValue: '' },
        updatedBy: { type: DataTypes.INTEGER, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'crop_overrides', modelName: 'CropOverride' },
    );
  }
}
