import { DataTypes, Model } from 'sequelize';
import type { CreationOptional, InferAttributes, InferCreationAttributes, Sequelize } from 'sequelize';
import type { BedKind } from '#shared/schemas/beds';

export class Bed extends Model<InferAttributes<Bed>, InferCreationAttributes<Bed>> {
  declare id: CreationOptional<number>;
  declare gardenId: number;
  declare name: string;
  declare kind: BedKind;
  declare lengthM: number | null;
  declare widthM: number | null;
  declare notes: string;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Bed.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        gardenId: { type: DataTypes.INTEGER, allowNull: false },
        name: { type: DataTypes.STRING(80), allowNull: false },
        kind: { type: DataTypes.ENUM('bed', 'raised-bed', 'plot', 'row', 'container'), allowNull: false },
        lengthM: { type: DataTypes.DOUBLE, allowNull: true },
        widthM: { type: DataTypes.DOUBLE, allowNull: true },
        notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'beds', modelName: 'Bed' },
    );
  }
}
