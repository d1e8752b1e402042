import { DataTypes, Model } from 'sequelize';
import type { CreationOptional, InferAttributes, InferCreationAttributes, Sequelize } from 'sequelize';

export class GerminationTest extends Model<InferAttributes<GerminationTest>, InferCreationAttributes<GerminationTest>> {
  declare id: CreationOptional<number>;
  declare gardenId: number;
  declare seedLotId: number;
  declare testedOn: string;
  declare seedsTested: number;
  declare germinated: number;
  declare notes: string;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    GerminationTest.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        gardenId: { type: DataTypes.INTEGER, allowNull: false },
        seedLotId: { type: DataTypes.INTEGER, allowNull: false },
        testedOn: { type: DataTypes.DATEONLY, allowNull: false },
        seedsTested: { type: DataTypes.INTEGER, allowNull: false },
        germinated: { type: DataTypes.INTEGER, allowNull: false },
        notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'germination_tests', modelName: 'GerminationTest' },
    );
  }
}
