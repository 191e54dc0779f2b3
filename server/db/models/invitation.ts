import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { Role } from '../../../shared/access/roles';

/** A row of `invitations`: a single-use link to join an organization (or to accept an auditor grant). */
export class Invitation extends Model<InferAttributes<Invitation>, InferCreationAttributes<Invitation>> {
  declare id: CreationOptional<string>;
  declare organizationId: string;
  /** The lab that sent an invitation into its client's organization, when it was not that organization. */
  declare sponsorOrganizationId: string | null;
  declare kind: 'member' | 'auditor';
  declare email: string;
  declare role: Role | null;
  declare auditorGrantId: string | null;
  declare tokenHash: string;
  declare invitedBy: string | null;
  declare expiresAt: Date;
  declare acceptedAt: CreationOptional<Date | null>;
  declare acceptedBy: CreationOptional<string | null>;
  declare revokedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    Invitation.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        organizationId: { type: DataTypes.UUID, allowNull: false },
        sponsorOrganizationId: { type: DataTypes.UUID },
        kind: { type: DataTypes.TEXT, allowNull: false },
        email: { type: DataTypes.TEXT, allowNull: false },
        role: { type: DataTypes.TEXT },
        auditorGrantId: { type: DataTypes.UUID },
        tokenHash: { type: DataTypes.TEXT, allowNull: false },
        invitedBy: { type: DataTypes.UUID },
        expiresAt: { type: DataTypes.DATE, allowNull: false },
        acceptedAt: { type: DataTypes.DATE },
        acceptedBy: { type: DataTypes.UUID },
        revokedAt: { type: DataTypes.DATE },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'invitations' },
    );
  }
}
