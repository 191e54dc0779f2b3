import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { RunState } from '../../../shared/runs/run-state';

/** A row of `test_runs`. */
export class TestRun extends Model<InferAttributes<TestRun>, InferCreationAttributes<TestRun>> {
  declare id: CreationOptional<string>;
  declare organizationId: string;
  declare planId: string;
  declare number: string;
  declare state: RunState;
  declare engineerId: string | null;
  declare reviewerId: string | null;
  declare returnReason: string | null;
  declare testedFrom: string | null;
  declare testedTo: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    TestRun.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        organizationId: { type: DataTypes.UUID, allowNull: false },
        planId: { type: DataTypes.UUID, allowNull: false },
        number: { type: DataTypes.TEXT, allowNull: false },
        state: { type: DataTypes.TEXT, allowNull: false },
        engineerId: { type: DataTypes.UUID },
        reviewerId: { type: DataTypes.UUID },
        returnReason: { type: DataTypes.TEXT },
        testedFrom: { type: DataTypes.DATEONLY },
        testedTo: { type: DataTypes.DATEONLY },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'test_runs' },
    );
  }
}
