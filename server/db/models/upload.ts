import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { UploadFormat } from '../../../shared/schemas/uploads';

/** A row of `uploads` (migration 0005): one raw trace or I/Q recording as received, and its analysis. */
export class Upload extends Model<InferAttributes<Upload>, InferCreationAttributes<Upload>> {
  declare id: string;
  declare organizationId: string;
  declare runId: string;
  declare testCaseId: string;
  declare format: UploadFormat;
  /** The sender's file name, sanitized; metadata only, never part of a path. */
  declare fileName: string;
  declare fileKey: string;
  declare fileSizeBytes: number;
  declare fileSha256: string;
  declare dataFileName: string | null;
  declare dataKey: string | null;
  declare dataSizeBytes: number | null;
  declare dataSha256: string | null;
  declare parameters: Record<string, unknown>;
  declare analysis: Record<string, unknown>;
  declare engineVersion: string;
  declare uploadedBy: string | null;
  declare apiKeyId: string | null;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    // bigint columns come back as strings from pg: read them as numbers (files stay far below 2^53 bytes).
    const bigint = (name: string) => ({
      type: DataTypes.BIGINT,
      get(this: Upload) {
        const raw = this.getDataValue(name as 'fileSizeBytes');
        return raw === null || raw === undefined ? raw : Number(raw);
      },
    });
    Upload.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true },
        organizationId: { type: DataTypes.UUID, allowNull: false },
        runId: { type: DataTypes.UUID, allowNull: false },
        testCaseId: { type: DataTypes.UUID, allowNull: false },
        format: { type: DataTypes.TEXT, allowNull: false },
        fileName: { type: DataTypes.TEXT, allowNull: false },
        fileKey: { type: DataTypes.TEXT, allowNull: false },
        fileSizeBytes: { ...bigint('fileSizeBytes'), allowNull: false },
        fileSha256: { type: DataTypes.TEXT, allowNull: false },
        dataFileName: { type: DataTypes.TEXT },
        dataKey: { type: DataTypes.TEXT },
        dataSizeBytes: bigint('dataSizeBytes'),
        dataSha256: { type: DataTypes.TEXT },
        parameters: { type: DataTypes.JSONB, allowNull: false },
        analysis: { type: DataTypes.JSON, allowNull: false },
        engineVersion: { type: DataTypes.TEXT, allowNull: false },
        uploadedBy: { type: DataTypes.UUID },
        apiKeyId: { type: DataTypes.UUID },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'uploads', updatedAt: false },
    );
  }
}
