import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export type CreditLedgerKind = 'purchase' | 'consumption' | 'refund' | 'adjustment';

/**
 * A row of `credit_ledger` (migration 0004): one signed change of a client's report credits at a
 * lab. Append-only; a balance is the SUM of `credits` over the rows of one (lab, client).
 */
export class CreditLedgerEntry extends Model<InferAttributes<CreditLedgerEntry>, InferCreationAttributes<CreditLedgerEntry>> {
  declare id: CreationOptional<string>;
  declare organizationId: string;
  declare clientId: string;
  declare kind: CreditLedgerKind;
  declare credits: number;
  declare reason: string | null;
  declare createdBy: string | null;
  declare purchaseId: string | null;
  declare reportId: string | null;
  declare providerEventId: string | null;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    CreditLedgerEntry.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        organizationId: { type: DataTypes.UUID, allowNull: false },
        clientId: { type: DataTypes.UUID, allowNull: false },
        kind: { type: DataTypes.TEXT, allowNull: false },
        credits: { type: DataTypes.INTEGER, allowNull: false },
        reason: { type: DataTypes.TEXT },
        createdBy: { type: DataTypes.UUID },
        purchaseId: { type: DataTypes.UUID },
        reportId: { type: DataTypes.UUID },
        providerEventId: { type: DataTypes.TEXT },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'credit_ledger', updatedAt: false },
    );
  }
}
