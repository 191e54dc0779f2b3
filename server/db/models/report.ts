import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** A row of `reports`. */
export class Report extends Model<InferAttributes<Report>, InferCreationAttributes<Report>> {
  declare id: CreationOptional<string>;
  declare organizationId: string;
  declare runId: string;
  declare clientOrganizationId: string | null;
  declare reportNumber: string;
  declare revision: CreationOptional<number>;
  declare replacesReportId: string | null;
  declare replacesReason: string | null;
  declare verifyToken: string;
  declare sha256: string;
  declare pdf: Buffer;
  declare pageCount: number;
  declare summary: Record<string, unknown>;
  declare issuedBy: string;
  declare issuedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    Report.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        organizationId: { type: DataTypes.UUID, allowNull: false },
        runId: { type: DataTypes.UUID, allowNull: false },
        clientOrganizationId: { type: DataTypes.UUID },
        reportNumber: { type: DataTypes.TEXT, allowNull: false },
        revision: { type: DataTypes.INTEGER, allowNull: false, defaultValue: 1 },
        replacesReportId: { type: DataTypes.UUID },
        replacesReason: { type: DataTypes.TEXT },
        verifyToken: { type: DataTypes.TEXT, allowNull: false },
      sha256: { type: DataTypes.TEXT, allowNull: false },
        pdf: { type: DataTypes.BLOB, allowNull: false },
        pageCount: { type: DataTypes.INTEGER, allowNull: false },
        summary: { type: DataTypes.JSONB, allowNull: false },
        issuedBy: { type: DataTypes.UUID, allowNull: false },
        issuedAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
      },
      { sequelize, tableName: 'reports', timestamps: false },
    );
  }
}
