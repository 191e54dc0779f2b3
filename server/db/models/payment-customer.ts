import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** A row of `payment_customers` (migration 0004): the payment provider's customer of a paying organization. */
export class PaymentCustomer extends Model<InferAttributes<PaymentCustomer>, InferCreationAttributes<PaymentCustomer>> {
  declare organizationId: string;
  declare providerCustomerId: string;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    PaymentCustomer.init(
      {
        organizationId: { type: DataTypes.UUID, primaryKey: true },
        providerCustomerId: { type: DataTypes.TEXT, allowNull: false },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'payment_customers', updatedAt: false },
    );
  }
}
