import { DataTypes, Model } from 'sequelize';
import type { CreationOptional, InferAttributes, InferCreationAttributes, Sequelize } from 'sequelize';
import type { DtmFrom, VarietyTrait } from '#shared/schemas/varieties';
import { DD_CUTOFFS, DD_METHODS } from '#shared/crops/params';
import type { ParamValue } from '#shared/crops/params';

export class Variety extends Model<InferAttributes<Variety>, InferCreationAttributes<Variety>> {
  declare id: CreationOptional<number>;
  declare gardenId: number;
  declare cropKey: string;
  declare name: string;
  declare dtmDays: number | null;
  declare dtmFrom: DtmFrom;
  declare emergenceDaysMin: number | null;
  declare emergenceDaysMax: number | null;
  declare boltTolerance: number | null;
  declare heatTolerance: number | null;
  /** Stored as a comma-separated list; always read and written as an array. */
  declare traits: VarietyTrait[];
  declare containerFriendly: boolean;
  declare sunHours: number | null;
  declare waterCmPerWeek: number | null;
  declare sowDepthCm: number | null;
  declare spacingCm: number | null;
  declare thinSpacingCm: number | null;
  declare gddTargetOverrideC: number | null;
  /**
   * The method the override was counted with (°C), set by the server when a grower sets it; all
   * null on rows from before 0007, read as the crop's library default method.
   */
  declare gddTargetBaseC: CreationOptional<number | null>;
  declare gddTargetUpperC: CreationOptional<number | null>;
  declare gddTargetMethod: CreationOptional<ParamValue<'method'> | null>;
  declare gddTargetCutoff: CreationOptional<ParamValue<'cutoff'> | null>;
  declare notes: string;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Variety.init(
      {
        id: { type: DataTypes.INTEGER, autoIncrement: true, primaryKey: true },
        gardenId: { type: DataTypes.INTEGER, allowNull: false },
        cropKey: { type: DataTypes.STRING(40), allowNull: false },
        name: { type: DataTypes.STRING(100), allowNull: false },
        dtmDays: { type: DataTypes.INTEGER, allowNull: true },
        dtmFrom: { type: DataTypes.ENUM('sowing', 'emergence', 'transplant'), allowNull: false },
        emergenceDaysMin: { type: DataTypes.INTEGER, allowNull: true },
        emergenceDaysMax: { type: DataTypes.INTEGER, allowNull: true },
        boltTolerance: { type: DataTypes.TINYINT, allowNull: true },
        heatTolerance: { type: DataTypes.TINYINT, allowNull: true },
        traits: {
          type: DataTypes.STRING(200),
          allowNull: false,
          defaultValue: '',
          get() {
            const raw = this.getDataValue('traits') as unknown as string;
            return raw ? (raw.split(',')) : [];
          },
          set(value: VarietyTrait[]) {
            this.setDataValue('traits', value.join(',') as unknown as VarietyTrait[]);
          },
        },
        containerFriendly: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        sunHours: { type: DataTypes.DOUBLE, allowNull: true },
        waterCmPerWeek: { type: DataTypes.DOUBLE, allowNull: true },
        sowDepthCm: { type: DataTypes.DOUBLE, allowNull: true },
        spacingCm: { type: DataTypes.DOUBLE, allowNull: true },
        thinSpacingCm: { type: DataTypes.DOUBLE, allowNull: true },
        gddTargetOverrideC: { type: DataTypes.DOUBLE, allowNull: true },
        gddTargetBaseC: { type: DataTypes.DOUBLE, allowNull: true },
        gddTargetUpperC: { type: DataTypes.DOUBLE, allowNull: true },
        gddTargetMethod: { type: DataTypes.ENUM(...DD_METHODS), allowNull: true },
        gddTargetCutoff: { type: DataTypes.ENUM(...DD_CUTOFFS), allowNull: true },
        notes: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'varieties', modelName: 'Variety' },
    );
  }
}
