import { DataTypes, Model, type Sequelize } from 'sequelize';

/** A message captured by the local SMTP stand-in (the admin's outbox). */
export class MailMessage extends Model {
  declare id: string;
  declare sentAt: Date;
  declare sender: string | null;
  declare recipients: string[];
  declare subject: string;
  declare text: string;
  declare raw: string;

  static initModel(sequelize: Sequelize) {
    MailMessage.init(
      {
        id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true },
        sentAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
        sender: { type: DataTypes.TEXT },
        recipients: { type: DataTypes.ARRAY(DataTypes.TEXT), allowNull: false },
        subject: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        text: { type: DataTypes.TEXT, allowNull: false, defaultValue: '' },
        raw: { type: DataTypes.TEXT, allowNull: false },
      },
      { sequelize, tableName: 'mail_messages', underscored: true, timestamps: false },
    );
  }
}
