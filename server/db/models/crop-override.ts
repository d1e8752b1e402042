import { DataTypes, Model } from 'sequelize';
import type { CreationOptional, InferAttributes, InferCreationAttributes, Sequelize } from 'sequelize';
import { DD_CUTOFFS, DD_METHODS } from '#shared/crops/params';
import type { ParamValue } from '#shared/crops/params';

/** One garden's own value for one crop parameter; value is JSON so numbers, words and yes/no fit one column. */
export class CropOverride extends Model<InferAttributes<CropOverride>, InferCreationAttributes<CropOverride>> {
  declare id: CreationOptional<number>;
  declare gardenId: number;
  declare cropKey: string;
  declare paramKey: string;
  declare valueJson: string;
  declare note: string;
  declare updatedBy: number | null;
  /**
   * For a degree-day figure (juvenileGdd), the method it was counted with (°C); all null for
   * other parameters and for rows from before 0007, read as the crop's library default method.
   */
  declare ddBaseC: CreationOptional<number | null>;
  declare ddUpperC: CreationOptional<number | null>;
  declare ddMethod: CreationOptional<ParamValue<'method'> | null>;
  declare ddCutoff: CreationOptional<ParamValue<'cutoff'> | null>;
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
        ddBaseC: { type: DataTypes.DOUBLE, allowNull: true },
        ddUpperC: { type: DataTypes.DOUBLE, allowNull: true },
        ddMethod: { type: DataTypes.ENUM(...DD_METHODS), allowNull: true },
        ddCutoff: { type: DataTypes.ENUM(...DD_CUTOFFS), allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'crop_overrides', modelName: 'CropOverride' },
    );
  }
}
