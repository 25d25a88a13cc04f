import { DataTypes, Model, type Sequelize } from 'sequelize';
import type { Role } from '../../shared/auth/roles';

export class User extends Model {
  declare id: string;
  declare email: string;
  declare name: string;
  declare role: Role;
  declare passwordHash: string;
  declare disabled: boolean;
  /** Added to on a password change, role change or disable; tokens carrying an older one are refused. */
  declare tokenVersion: number;
  declare createdAt: Date;
  declare updatedAt: Date;

  static initModel(sequelize: Sequelize) {
    User.init(
      {
        id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true },
        email: { type: DataTypes.TEXT, allowNull: false },
        name: { type: DataTypes.TEXT, allowNull: false },
        role: { type: DataTypes.ENUM('operator', 'engineer', 'accountant', 'admin'), allowNull: false },
        passwordHash: { type: DataTypes.TEXT, allowNull: false },
        disabled: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        tokenVersion: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 0 },
      },
      { sequelize, tableName: 'users', underscored: true },
    );
  }
}
