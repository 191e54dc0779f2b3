import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** A row of `readings`. */
export class Reading extends Model<InferAttributes<Reading>, InferCreationAttributes<Reading>> {
  declare id: CreationOptional<string>;
  declare organizationId: string;
  declare runId: string;
  declare testCaseId: string;
  declare values: Record<string, unknown>;
  declare enteredBy: string | null;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    Reading.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        organizationId: { type: DataTypes.UUID, allowNull: false },
        runId: { type: DataTypes.UUID, allowNull: false },
        testCaseId: { type: DataTypes.UUID, allowNull: false },
        values: { type: DataTypes.JSONB, allowNull: false },
        enteredBy: { type: DataTypes.UUID },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'readings', updatedAt: false },
    );
  }
}
