import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export type CreditPurchaseStatus = 'pending' | 'completed' | 'expired' | 'needs-review';

/**
 * A row of `credit_purchases` (migration 0004): a pack of report credits a manufacturer buys from
 * a lab through a checkout session. `organizationId` is the lab; the buyer is the manufacturer.
 */
export class CreditPurchase extends Model<InferAttributes<CreditPurchase>, InferCreationAttributes<CreditPurchase>> {
  declare id: CreationOptional<string>;
  declare organizationId: string;
  declare clientId: string;
  declare buyerOrganizationId: string;
  declare boughtBy: string | null;
  declare packId: string;
  declare credits: number;
  declare amountMinor: number;
  declare currency: string;
  declare status: CreditPurchaseStatus;
  declare checkoutSessionId: string | null;
  declare paymentIntentId: string | null;
  declare lastPaymentError: string | null;
  declare completedAt: Date | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    CreditPurchase.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        organizationId: { type: DataTypes.UUID, allowNull: false },
        clientId: { type: DataTypes.UUID, allowNull: false },
        buyerOrganizationId: { type: DataTypes.UUID, allowNull: false },
        boughtBy: { type: DataTypes.UUID },
        packId: { type: DataTypes.TEXT, allowNull: false },
        credits: { type: DataTypes.INTEGER, allowNull: false },
        amountMinor: { type: DataTypes.INTEGER, allowNull: false },
        currency: { type: DataTypes.TEXT, allowNull: false },
        status: { type: DataTypes.TEXT, allowNull: false },
        checkoutSessionId: { type: DataTypes.TEXT },
        paymentIntentId: { type: DataTypes.TEXT },
        lastPaymentError: { type: DataTypes.TEXT },
        completedAt: { type: DataTypes.DATE },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'credit_purchases' },
    );
  }
}
