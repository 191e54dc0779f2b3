import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** A row of `api_keys`: a lab's bench-automation key, stored as its SHA-256 with a short visible prefix. */
export class ApiKey extends Model<InferAttributes<ApiKey>, InferCreationAttributes<ApiKey>> {
  declare id: CreationOptional<string>;
  declare organizationId: string;
  declare name: string;
  declare prefix: string;
  declare keyHash: string;
  declare createdBy: string | null;
  declare createdAt: CreationOptional<Date>;
  declare lastUsedAt: CreationOptional<Date | null>;
  declare revokedAt: CreationOptional<Date | null>;

  static initModel(sequelize: Sequelize): void {
    ApiKey.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        organizationId: { type: DataTypes.UUID, allowNull: false },
        name: { type: DataTypes.TEXT, allowNull: false },
        prefix: { type: DataTypes.TEXT, allowNull: false },
        keyHash: { type: DataTypes.TEXT, allowNull: false },
        createdBy: { type: DataTypes.UUID },
        createdAt: DataTypes.DATE,
        lastUsedAt: { type: DataTypes.DATE },
        revokedAt: { type: DataTypes.DATE },
      },
      { sequelize, tableName: 'api_keys', updatedAt: false },
    );
  }
}
