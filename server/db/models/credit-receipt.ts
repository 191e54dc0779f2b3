import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** A row of `credit_receipts` (migration 0004): the PDF receipt of a completed purchase; never changed. */
export class CreditReceipt extends Model<InferAttributes<CreditReceipt>, InferCreationAttributes<CreditReceipt>> {
  declare purchaseId: string;
  declare organizationId: string;
  declare clientId: string;
  declare receiptNumber: string;
  declare sha256: string;
  declare pdf: Buffer;
  declare issuedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    CreditReceipt.init(
      {
        purchaseId: { type: DataTypes.UUID, primaryKey: true },
        organizationId: { type: DataTypes.UUID, allowNull: false },
        clientId: { type: DataTypes.UUID, allowNull: false },
        receiptNumber: { type: DataTypes.TEXT, allowNull: false },
        sha256: { type: DataTypes.TEXT, allowNull: false },
        pdf: { type: DataTypes.BLOB, allowNull: false },
        issuedAt: { type: DataTypes.DATE, allowNull: false, defaultValue: DataTypes.NOW },
      },
      { sequelize, tableName: 'credit_receipts', timestamps: false },
    );
  }
}
