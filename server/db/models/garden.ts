import { DataTypes, Model } from 'sequelize';
import type { CreationOptional, InferAttributes, InferCreationAttributes, Sequelize } from 'sequelize';

export class Garden extends Model<InferAttributes<Garden>, InferCreationAttributes<Garden>> {
  declare id: CreationOptional<number>;
  declare name: string;
  declare latitude: number | null;
  declare longitude: number | null;
  declare elevationM: number | null;
  declare timeZone: string;
  declare units: 'F' | 'C';
  declare weatherCellId: CreationOptional<number | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Garden.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        name: { type: DataTypes.STRING(120), allowNull: false },
        latitude: { type: DataTypes.DOUBLE, allowNull: true },
        longitude: { type: DataTypes.DOUBLE, allowNull: true },
        elevationM: { type: DataTypes.DOUBLE, allowNull: true },
        timeZone: { type: DataTypes.STRING(64), allowNull: false, defaultValue: 'UTC' },
        units: { type: DataTypes.ENUM('F', 'C'), allowNull: false, defaultValue: 'F' },
        weatherCellId: { type: DataTypes.INTEGER, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'gardens', modelName: 'Garden' },
    );
  }
}
