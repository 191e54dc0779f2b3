import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { RuleSetBody } from '../../../shared/rules/rule-set';

/** A row of `rule_sets`. */
export class RuleSet extends Model<InferAttributes<RuleSet>, InferCreationAttributes<RuleSet>> {
  declare id: CreationOptional<string>;
  declare organizationId: string | null;
  declare key: string;
  declare version: number;
  declare name: string;
  declare service: string;
  declare isSample: CreationOptional<boolean>;
  declare body: RuleSetBody;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    RuleSet.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        organizationId: { type: DataTypes.UUID },
        key: { type: DataTypes.TEXT, allowNull: false },
        version: { type: DataTypes.INTEGER, allowNull: false },
        name: { type: DataTypes.TEXT, allowNull: false },
        service: { type: DataTypes.TEXT, allowNull: false },
        isSample: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        body: { type: DataTypes.JSONB, allowNull: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'rule_sets' },
    );
  }
}
