import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { RuleSetBody } from '../../../shared/rules/rule-set';

/** A row of `test_plans`. */
export class TestPlan extends Model<InferAttributes<TestPlan>, InferCreationAttributes<TestPlan>> {
  declare id: CreationOptional<string>;
  declare organizationId: string;
  declare deviceId: string;
  declare ruleSetId: string;
  declare ruleSetSnapshot: RuleSetBody;
  declare name: string;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    TestPlan.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        organizationId: { type: DataTypes.UUID, allowNull: false },
        deviceId: { type: DataTypes.UUID, allowNull: false },
        ruleSetId: { type: DataTypes.UUID, allowNull: false },
        ruleSetSnapshot: { type: DataTypes.JSONB, allowNull: false },
        name: { type: DataTypes.TEXT, allowNull: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'test_plans' },
    );
  }
}
