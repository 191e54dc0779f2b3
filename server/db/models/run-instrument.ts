import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** A row of `run_instruments`: one instrument used on one test run (migration 0003). */
export class RunInstrument extends Model<InferAttributes<RunInstrument>, InferCreationAttributes<RunInstrument>> {
  declare organizationId: string;
  declare runId: string;
  declare instrumentId: string;
  declare assignedBy: string | null;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    RunInstrument.init(
      {
        organizationId: { type: DataTypes.UUID, allowNull: false, primaryKey: true },
        runId: { type: DataTypes.UUID, allowNull: false, primaryKey: true },
        instrumentId: { type: DataTypes.UUID, allowNull: false, primaryKey: true },
        assignedBy: { type: DataTypes.UUID },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'run_instruments', updatedAt: false },
    );
  }
}
