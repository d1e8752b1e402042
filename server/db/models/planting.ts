import { DataTypes, Model } from 'sequelize';
import type { CreationOptional, InferAttributes, InferCreationAttributes, NonAttribute, Sequelize } from 'sequelize';
import type { PlantingMethod, PlantingQuantityUnit, PlantingStatus } from '#shared/schemas/plantings';
import type { Bed } from './bed';
import type { Variety } from './variety';
import type { SeedLot } from './seed-lot';
import { seasonInputs, seasonYearOf } from '../planting-season';

/** What a planting's season is read from (start-event.ts); a save touching none of them keeps it. */
const SEASON_FIELDS = ['method', 'status', 'sownOn', 'emergedOn', 'transplantedOn', 'varietyId', 'gardenId'] as const;

export class Planting extends Model<InferAttributes<Planting>, InferCreationAttributes<Planting>> {
  declare id: CreationOptional<number>;
  declare gardenId: number;
  declare bedId: number;
  declare varietyId: number;
  declare seedLotId: number | null;
  declare method: PlantingMethod;
  declare status: PlantingStatus;
  declare quantity: number | null;
  declare quantityUnit: PlantingQuantityUnit;
  declare sownOn: string | null;
  declare emergedOn: string | null;
  declare thinnedOn: string | null;
  declare transplantedOn: string | null;
  declare firstHarvestOn: string | null;
  declare lastHarvestOn: string | null;
  declare boltedOn: string | null;
  declare startOn: string | null;
  /** The growing season's start year (planting-season.ts), written by the beforeSave hook. */
  declare seasonYear: CreationOptional<number | null>;
  declare notes: string;
  declare createdBy: number | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;
  declare bed?: NonAttribute<Bed>;
  declare variety?: NonAttribute<Variety>;
  declare seedLot?: NonAttribute<SeedLot | null>;

  static initModel(sequelize: Sequelize) {
    // A fresh object per attribute: Sequelize writes each attribute's column name into its definition.
    const date = () => ({ type: DataTypes.DATEONLY, allowNull: true });
    Planting.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        gardenId: { type: DataTypes.INTEGER, allowNull: false },
        bedId: { type: DataTypes.INTEGER, allowNull: false },
        varietyId: { type: DataTypes.INTEGER, allowNull: false },
        seedLotId: { type: DataTypes.INTEGER, allowNull: true },
        method: { type: DataTypes.ENUM('direct-sow', 'transplant', 'indoor-start'), allowNull: false },
        status: { type: DataTypes.ENUM('planned', 'growing', 'harvested', 'bolted', 'failed'), allowNull: false },
        quantity: { type: DataTypes.DOUBLE, allowNull: true },
        quantityUnit: { type: DataTypes.ENUM('plants', 'seeds', 'row-m', 'grams'), allowNull: false, defaultValue: 'plants' },
        sownOn: date(),
        emergedOn: date(),
        thinnedOn: date(),
        transplantedOn: date(),
        firstHarvestOn: date(),
        lastHarvestOn: date(),
        boltedOn: date(),
        startOn: date(),
        seasonYear: { type: DataTypes.SMALLINT, allowNull: true },
        notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        createdBy: { type: DataTypes.INTEGER, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      {
        sequelize,
        tableName: 'plantings',
        modelName: 'Planting',
        hooks: {
          // The natural key's start date always follows the stage dates it is made from.
          // The stored season follows the one start-event rule, whatever path saved the planting.
          beforeSave: async (p, options) => {
            p.startOn = p.sownOn ?? p.transplantedOn ?? null;
            if (!p.isNewRecord && !SEASON_FIELDS.some((k) => p.changed(k))) return;
            const inputs = await seasonInputs(Planting.sequelize!, p.gardenId, p.varietyId, options.transaction);
            p.seasonYear = inputs ? seasonYearOf(p, inputs.variety, inputs.latitude) : null;
          },
        },
      },
    );
  }
}
