import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** A row of `auditor_grants`: read-only access for one outside person to some of a lab's issued reports. */
export class AuditorGrant extends Model<InferAttributes<AuditorGrant>, InferCreationAttributes<AuditorGrant>> {
  declare id: CreationOptional<string>;
  declare organizationId: string;
  declare email: string;
  /** Set when the auditor accepts the invitation; until then the grant shows nothing. */
  declare auditorUserId: CreationOptional<string | null>;
  declare scope: 'all' | 'client' | 'device';
  declare clientId: string | null;
  declare deviceId: string | null;
  /** Last day of access (inclusive), ISO date. */
  declare expiresOn: string;
  declare note: string | null;
  declare grantedBy: string | null;
  declare acceptedAt: CreationOptional<Date | null>;
  declare revokedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    AuditorGrant.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        organizationId: { type: DataTypes.UUID, allowNull: false },
        email: { type: DataTypes.TEXT, allowNull: false },
        auditorUserId: { type: DataTypes.UUID },
        scope: { type: DataTypes.TEXT, allowNull: false },
        clientId: { type: DataTypes.UUID },
        deviceId: { type: DataTypes.UUID },
        expiresOn: { type: DataTypes.DATEONLY, allowNull: false },
        note: { type: DataTypes.TEXT },
        grantedBy: { type: DataTypes.UUID },
        acceptedAt: { type: DataTypes.DATE },
        revokedAt: { type: DataTypes.DATE },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'auditor_grants' },
    );
  }
}
