import { DataTypes, Model } from 'sequelize';
import type { CreationOptional, InferAttributes, InferCreationAttributes, NonAttribute, Sequelize } from 'sequelize';
import type { User } from './user';

export class PlantingPhoto extends Model<InferAttributes<PlantingPhoto>, InferCreationAttributes<PlantingPhoto>> {
  declare id: CreationOptional<number>;
  declare gardenId: number;
  declare plantingId: number;
  /** Random file name inside the uploads folder; never derived from the upload's own name. */
  declare storageName: string;
  declare width: number;
  declare height: number;
  declare bytes: number;
  declare caption: string;
  declare takenOn: string;
  declare createdBy: number | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare author?: NonAttribute<User | null>;

  static initModel(sequelize: Sequelize) {
    PlantingPhoto.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        gardenId: { type: DataTypes.INTEGER, allowNull: false },
        plantingId: { type: DataTypes.INTEGER, allowNull: false },
        storageName: { type: DataTypes.STRING(64), allowNull: false, unique: true },
        width: { type: DataTypes.INTEGER, allowNull: false },
        height: { type: DataTypes.INTEGER, allowNull: false },
        bytes: { type: DataTypes.INTEGER, allowNull: false },
        caption: { type: DataTypes.STRING(300), allowNull: false, defaultValue: '' },
        takenOn: { type: DataTypes.DATEONLY, allowNull: false },
        createdBy: { type: DataTypes.INTEGER, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'planting_photos', modelName: 'PlantingPhoto' },
    );
  }
}
