import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** A row of `devices`. */
export class Device extends Model<InferAttributes<Device>, InferCreationAttributes<Device>> {
  declare id: CreationOptional<string>;
  declare organizationId: string;
  declare clientId: string;
  declare manufacturer: string;
  declare model: string;
  declare serialNumber: string;
  declare firmware: string | null;
  declare ratedPepW: number;
  declare emissionDesignator: string;
  declare frequencyMinHz: number;
  declare frequencyMaxHz: number;
  declare modes: string[];
  declare receivedOn: string;
  declare condition: string;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    Device.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        organizationId: { type: DataTypes.UUID, allowNull: false },
        clientId: { type: DataTypes.UUID, allowNull: false },
        manufacturer: { type: DataTypes.TEXT, allowNull: false },
        model: { type: DataTypes.TEXT, allowNull: false },
        serialNumber: { type: DataTypes.TEXT, allowNull: false },
        firmware: { type: DataTypes.TEXT },
        ratedPepW: { type: DataTypes.DOUBLE, allowNull: false },
        emissionDesignator: { type: DataTypes.TEXT, allowNull: false },
        frequencyMinHz: { type: DataTypes.DOUBLE, allowNull: false },
        frequencyMaxHz: { type: DataTypes.DOUBLE, allowNull: false },
        modes: { type: DataTypes.ARRAY(DataTypes.TEXT), allowNull: false },
        receivedOn: { type: DataTypes.DATEONLY, allowNull: false },
        condition: { type: DataTypes.TEXT, allowNull: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'devices' },
    );
  }
}
