import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** A lab's report-signing key and certificate; the private key is stored encrypted. */
export class SigningIdentity extends Model<InferAttributes<SigningIdentity>, InferCreationAttributes<SigningIdentity>> {
  declare id: CreationOptional<string>;
  declare organizationId: string;
  declare certificatePem: string;
  declare encryptedPrivateKey: string;
  declare source: 'generated' | 'uploaded';
  declare active: CreationOptional<boolean>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    SigningIdentity.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        organizationId: { type: DataTypes.UUID, allowNull: false },
        certificatePem: { type: DataTypes.TEXT, allowNull: false },
        encryptedPrivateKey: { type: DataTypes.TEXT, allowNull: false },
        source: { type: DataTypes.TEXT, allowNull: false },
        active: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'signing_identities' },
    );
  }
}
