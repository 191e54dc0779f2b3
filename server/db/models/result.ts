import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** A row of `results`. */
export class Result extends Model<InferAttributes<Result>, InferCreationAttributes<Result>> {
  declare id: CreationOptional<string>;
  declare organizationId: string;
  declare runId: string;
  declare testCaseId: string;
  /** The reading it was computed from, or null when it comes from an upload (migration 0005). */
  declare readingId: string | null;
  declare uploadId: CreationOptional<string | null>;
  declare engineVersion: string;
  declare value: number | null;
  declare unit: string;
  declare limitValue: number | null;
  declare margin: number | null;
  declare expandedUncertainty: number | null;
  declare coverageFactor: number | null;
  declare verdict: string;
  declare detail: CreationOptional<Record<string, unknown>>;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    Result.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        organizationId: { type: DataTypes.UUID, allowNull: false },
        runId: { type: DataTypes.UUID, allowNull: false },
        testCaseId: { type: DataTypes.UUID, allowNull: false },
        readingId: { type: DataTypes.UUID },
        uploadId: { type: DataTypes.UUID },
        engineVersion: { type: DataTypes.TEXT, allowNull: false },
        value: { type: DataTypes.DOUBLE },
        unit: { type: DataTypes.TEXT, allowNull: false },
        limitValue: { type: DataTypes.DOUBLE },
        margin: { type: DataTypes.DOUBLE },
        expandedUncertainty: { type: DataTypes.DOUBLE },
        coverageFactor: { type: DataTypes.DOUBLE },
        verdict: { type: DataTypes.TEXT, allowNull: false },
        detail: { type: DataTypes.JSONB, allowNull: false, defaultValue: {} },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'results', updatedAt: false },
    );
  }
}
