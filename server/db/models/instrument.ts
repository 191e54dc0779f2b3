import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** A row of `instruments`. */
export class Instrument extends Model<InferAttributes<Instrument>, InferCreationAttributes<Instrument>> {
  declare id: CreationOptional<string>;
  declare organizationId: string;
  declare name: string;
  declare model: string;
  declare serialNumber: string;
  declare calibratedOn: string;
  declare calibrationDue: string;
  declare certificateRef: string;
  declare contributions: CreationOptional<unknown[]>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    Instrument.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        organizationId: { type: DataTypes.UUID, allowNull: false },
        name: { type: DataTypes.TEXT, allowNull: false },
        model: { type: DataTypes.TEXT, allowNull: false },
        serialNumber: { type: DataTypes.TEXT, allowNull: false },
        calibratedOn: { type: DataTypes.DATEONLY, allowNull: false },
        calibrationDue: { type: DataTypes.DATEONLY, allowNull: false },
        certificateRef: { type: DataTypes.TEXT, allowNull: false },
        contributions: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'instruments' },
    );
  }
}
