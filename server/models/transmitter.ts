import { DataTypes, Model, type Sequelize } from 'sequelize';

export class Transmitter extends Model {
  declare id: string;
  declare meterRunId: string;
  declare tag: string;
  declare measures: 'differential-pressure' | 'static-pressure' | 'temperature' | 'flow-direction';
  declare unit: string;
  declare pressureReference: 'absolute' | 'gauge';
  declare lowerRange: number;
  declare upperRange: number;
  declare stackRole: 'single' | 'low' | 'high';
  declare accuracyPercentOfSpan: number;
  /** What kind of figure the accuracy is (migration 0023). */
  declare accuracyKind: 'expanded-k2' | 'rectangular-limit';
  declare calibrationDue: string | null;

  static initModel(sequelize: Sequelize) {
    Transmitter.init(
      {
        id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true },
        meterRunId: { type: DataTypes.BIGINT, allowNull: false },
        tag: { type: DataTypes.TEXT, allowNull: false },
        measures: {
          // 'flow-direction': a bi-directional meter run's direction input (migration 0024).
          type: DataTypes.ENUM('differential-pressure', 'static-pressure', 'temperature', 'flow-direction'),
          allowNull: false,
        },
        unit: { type: DataTypes.TEXT, allowNull: false },
        pressureReference: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'absolute' },
        lowerRange: { type: DataTypes.DOUBLE, allowNull: false },
        upperRange: { type: DataTypes.DOUBLE, allowNull: false },
        stackRole: { type: DataTypes.ENUM('single', 'low', 'high'), allowNull: false, defaultValue: 'single' },
        accuracyPercentOfSpan: { type: DataTypes.DOUBLE, allowNull: false },
        accuracyKind: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'expanded-k2' },
        calibrationDue: { type: DataTypes.DATEONLY },
      },
      { sequelize, tableName: 'transmitters', underscored: true },
    );
  }
}
