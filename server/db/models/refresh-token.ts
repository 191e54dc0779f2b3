import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** A row of `refresh_tokens`. */
export class RefreshToken extends Model<InferAttributes<RefreshToken>, InferCreationAttributes<RefreshToken>> {
  declare id: CreationOptional<string>;
  declare userId: string;
  declare familyId: string;
  declare tokenHash: string;
  declare expiresAt: Date;
  declare rotatedAt: Date | null;
  declare revokedAt: Date | null;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    RefreshToken.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        userId: { type: DataTypes.UUID, allowNull: false },
        familyId: { type: DataTypes.UUID, allowNull: false },
        tokenHash: { type: DataTypes.TEXT, allowNull: false },
        expiresAt: { type: DataTypes.DATE, allowNull: false },
        rotatedAt: { type: DataTypes.DATE },
        revokedAt: { type: DataTypes.DATE },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'refresh_tokens', updatedAt: false },
    );
  }
}
