import { DataTypes, Model, type Sequelize } from 'sequelize';

export class MeterRun extends Model {
  declare id: string;
  declare siteId: string;
  declare tag: string;
  declare name: string;
  declare holdLimitS: number;
  declare maxGapS: number;
  declare stackSwitchUpShare: number;
  declare stackSwitchDownShare: number;
  declare line: Record<string, unknown>;

  static initModel(sequelize: Sequelize) {
    MeterRun.init(
      {
        id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true },
        siteId: { type: DataTypes.BIGINT, allowNull: false },
        tag: { type: DataTypes.TEXT, allowNull: false },
        name: { type: DataTypes.TEXT, allowNull: false },
        holdLimitS: { type: DataTypes.DOUBLE, allowNull: false },
        maxGapS: { type: DataTypes.DOUBLE, allowNull: false },
        stackSwitchUpShare: { type: DataTypes.DOUBLE, allowNull: false },
        stackSwitchDownShare: { type: DataTypes.DOUBLE, allowNull: false },
        line: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
      },
      { sequelize, tableName: 'meter_runs', underscored: true },
    );
  }
}

/** The element, fluid and constants of a meter run from `effectiveFrom` on. */
export class ConfigVersion extends Model {
  declare id: string;
  declare meterRunId: string;
  declare effectiveFrom: Date;
  declare element: Record<string, unknown>;
  declare fluid: Record<string, unknown>;
  /** The element's constants in reverse flow: present ⇔ bi-directional from effectiveFrom (migration 0024). */
  declare reverseElement: Record<string, unknown> | null;
  declare directionSource: 'dp-sign' | 'direction-input' | null;
  declare reason: string;
  declare createdBy: string | null;
  declare createdAt: Date;

  static initModel(sequelize: Sequelize) {
    ConfigVersion.init(
      {
        id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true },
        meterRunId: { type: DataTypes.BIGINT, allowNull: false },
        effectiveFrom: { type: DataTypes.DATE, allowNull: false },
        element: { type: DataTypes.JSONB, allowNull: false },
        fluid: { type: DataTypes.JSONB, allowNull: false },
        reverseElement: { type: DataTypes.JSONB },
        directionSource: { type: DataTypes.TEXT },
        reason: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        createdBy: { type: DataTypes.BIGINT },
      },
      { sequelize, tableName: 'config_versions', underscored: true, updatedAt: false },
    );
  }
}
