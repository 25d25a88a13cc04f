import { DataTypes, Model, type Sequelize } from 'sequelize';

export class Site extends Model {
  declare id: string;
  declare code: string;
  declare name: string;
  declare timeZone: string;
  declare contractHour: number;
  declare basePressurePa: number;
  declare baseTemperatureK: number;
  declare atmosphericPressurePa: number;
  declare displayUnits: 'si' | 'us';

  static initModel(sequelize: Sequelize) {
    Site.init(
      {
        id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true },
        code: { type: DataTypes.TEXT, allowNull: false },
        name: { type: DataTypes.TEXT, allowNull: false },
        timeZone: { type: DataTypes.TEXT, allowNull: false },
        contractHour: { type: DataTypes.SMALLINT, allowNull: false },
        basePressurePa: { type: DataTypes.DOUBLE, allowNull: false },
        baseTemperatureK: { type: DataTypes.DOUBLE, allowNull: false },
        atmosphericPressurePa: { type: DataTypes.DOUBLE, allowNull: false },
        displayUnits: { type: DataTypes.TEXT, allowNull: false, defaultValue: 'si' },
      },
      { sequelize, tableName: 'sites', underscored: true },
    );
  }
}
