import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** A row of `report_status_changes`. */
export class ReportStatusChange extends Model<InferAttributes<ReportStatusChange>, InferCreationAttributes<ReportStatusChange>> {
  declare id: CreationOptional<string>;
  declare organizationId: string;
  declare reportId: string;
  declare status: 'withdrawn' | 'superseded';
  declare reason: string;
  declare supersededById: string | null;
  declare changedBy: string | null;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    ReportStatusChange.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        organizationId: { type: DataTypes.UUID, allowNull: false },
        reportId: { type: DataTypes.UUID, allowNull: false },
        status: { type: DataTypes.TEXT, allowNull: false },
        reason: { type: DataTypes.TEXT, allowNull: false },
        supersededById: { type: DataTypes.UUID },
        changedBy: { type: DataTypes.UUID },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'report_status_changes', updatedAt: false },
    );
  }
}
