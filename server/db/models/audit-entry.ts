import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** A row of `audit_log`. */
export class AuditEntry extends Model<InferAttributes<AuditEntry>, InferCreationAttributes<AuditEntry>> {
  declare id: CreationOptional<number>;
  declare organizationId: string | null;
  declare userId: string | null;
  /** The bench-automation key that made the change, when no person did (migration 0002). */
  declare apiKeyId: CreationOptional<string | null>;
  declare action: string;
  declare entity: string;
  declare entityId: string | null;
  declare before: unknown;
  declare after: unknown;
  declare at: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    AuditEntry.init(
      {
        id: { type: DataTypes.BIGINT, primaryKey: true, autoIncrement: true },
        organizationId: { type: DataTypes.UUID },
        userId: { type: DataTypes.UUID },
        apiKeyId: { type: DataTypes.UUID },
        action: { type: DataTypes.TEXT, allowNull: false },
        entity: { type: DataTypes.TEXT, allowNull: false },
        entityId: { type: DataTypes.TEXT },
        before: { type: DataTypes.JSONB },
        after: { type: DataTypes.JSONB },
        at: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
      },
      { sequelize, tableName: 'audit_log', timestamps: false },
    );
  }
}
