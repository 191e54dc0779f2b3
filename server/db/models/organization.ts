import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** A row of `organizations`. */
export class Organization extends Model<InferAttributes<Organization>, InferCreationAttributes<Organization>> {
  declare id: CreationOptional<string>;
  declare kind: 'lab' | 'manufacturer';
  declare name: string;
  declare code: string;
  declare addressLines: CreationOptional<string[]>;
  declare email: string | null;
  declare phone: string | null;
  declare accreditation: string | null;
  declare settings: CreationOptional<Record<string, unknown>>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    Organization.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        kind: { type: DataTypes.TEXT, allowNull: false },
        name: { type: DataTypes.TEXT, allowNull: false },
        code: { type: DataTypes.TEXT, allowNull: false },
        addressLines: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
        email: { type: DataTypes.TEXT },
        phone: { type: DataTypes.TEXT },
        accreditation: { type: DataTypes.TEXT },
        settings: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'organizations' },
    );
  }
}
