import { DataTypes, Model, type Sequelize } from 'sequelize';

export class AuditEvent extends Model {
  declare id: string;
  declare occurredAt: Date;
  declare actorId: string | null;
  declare actorEmail: string | null;
  declare action: string;
  declare entityType: string;
  declare entityId: string | null;
  declare before: unknown;
  declare after: unknown;
  declare reason: string | null;
  /** Set by the database's insert trigger (migration 0004): place in the chain and hashes. */
  declare chainSeq: string;
  declare previousHash: string | null;
  declare hash: string;

  static initModel(sequelize: Sequelize) {
    AuditEvent.init(
      {
        id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true },
        occurredAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
        actorId: { type: DataTypes.BIGINT },
        actorEmail: { type: DataTypes.TEXT },
        action: { type: DataTypes.TEXT, allowNull: false },
        entityType: { type: DataTypes.TEXT, allowNull: false },
        entityId: { type: DataTypes.TEXT },
        before: { type: DataTypes.JSONB },
        after: { type: DataTypes.JSONB },
        reason: { type: DataTypes.TEXT },
        chainSeq: { type: DataTypes.BIGINT },
        previousHash: { type: DataTypes.TEXT },
        hash: { type: DataTypes.TEXT },
      },
      { sequelize, tableName: 'audit_events', underscored: true, timestamps: false },
    );
  }
}
