import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** One pack a lab sells: `credits` report credits for `priceMinor` minor units of the list's currency. */
export interface StoredCreditPack {
  id: string;
  credits: number;
  priceMinor: number;
}

/** A row of `credit_price_lists` (migration 0004): a lab's packs of report credits and its refund policy. */
export class CreditPriceList extends Model<InferAttributes<CreditPriceList>, InferCreationAttributes<CreditPriceList>> {
  declare organizationId: string;
  declare currency: string;
  declare packs: StoredCreditPack[];
  declare refundOnWithdrawWithinDays: number | null;
  declare updatedBy: string | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    CreditPriceList.init(
      {
        organizationId: { type: DataTypes.UUID, primaryKey: true },
        currency: { type: DataTypes.TEXT, allowNull: false },
        packs: { type: DataTypes.JSONB, allowNull: false },
        refundOnWithdrawWithinDays: { type: DataTypes.INTEGER },
        updatedBy: { type: DataTypes.UUID },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'credit_price_lists' },
    );
  }
}
