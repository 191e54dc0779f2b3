import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** A row of `clients`. */
export class Client extends Model<InferAttributes<Client>, InferCreationAttributes<Client>> {
  declare id: CreationOptional<string>;
  declare organizationId: string;
  declare clientOrganizationId: string | null;
  declare name: string;
  declare addressLines: CreationOptional<string[]>;
  declare contactName: string;
  declare contactEmail: string;
  declare invoiceLater: CreationOptional<boolean>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    Client.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        organizationId: { type: DataTypes.UUID, allowNull: false },
        clientOrganizationId: { type: DataTypes.UUID },
        name: { type: DataTypes.TEXT, allowNull: false },
        addressLines: { type: DataTypes.JSONB, allowNull: false, defaultValue: [] },
        contactName: { type: DataTypes.TEXT, allowNull: false },
        contactEmail: { type: DataTypes.TEXT, allowNull: false },
        invoiceLater: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'clients' },
    );
  }
}
