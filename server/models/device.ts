import { DataTypes, Model, type Sequelize } from 'sequelize';

/** MQTT credentials an administrator issued to a field device of one site. */
export class Device extends Model {
  declare id: string;
  declare siteId: string;
  declare name: string;
  declare username: string;
  declare passwordHash: string;
  declare disabled: boolean;
  declare rejectedCount: string;
  declare acceptedCount: string;
  declare lastRejection: string | null;
  declare lastSeenAt: Date | null;
  declare createdAt: Date;

  static initModel(sequelize: Sequelize) {
    Device.init(
      {
        id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true },
        siteId: { type: DataTypes.BIGINT, allowNull: false },
        name: { type: DataTypes.TEXT, allowNull: false },
        username: { type: DataTypes.TEXT, allowNull: false },
        passwordHash: { type: DataTypes.TEXT, allowNull: false },
        disabled: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        rejectedCount: { type: DataTypes.BIGINT, allowNull: false, defaultValue: 0 },
        acceptedCount: { type: DataTypes.BIGINT, allowNull: false, defaultValue: 0 },
        lastRejection: { type: DataTypes.TEXT },
        lastSeenAt: { type: DataTypes.DATE },
      },
      { sequelize, tableName: 'devices', underscored: true, updatedAt: false },
    );
  }
}
