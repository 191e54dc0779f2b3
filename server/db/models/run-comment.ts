import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** A row of `run_comments` (migration 0006): one remark on one test case of a run; never changed. */
export class RunComment extends Model<InferAttributes<RunComment>, InferCreationAttributes<RunComment>> {
  declare id: CreationOptional<string>;
  declare organizationId: string;
  declare runId: string;
  declare testCaseId: string;
  declare authorId: string;
  declare authorRole: 'lab-admin' | 'engineer' | 'reviewer';
  declare body: string;
  declare createdAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize): void {
    RunComment.init(
      {
        id: { type: DataTypes.UUID, primaryKey: true, defaultValue: DataTypes.UUIDV4 },
        organizationId: { type: DataTypes.UUID, allowNull: false },
        runId: { type: DataTypes.UUID, allowNull: false },
        testCaseId: { type: DataTypes.UUID, allowNull: false },
        authorId: { type: DataTypes.UUID, allowNull: false },
        authorRole: { type: DataTypes.TEXT, allowNull: false },
        body: { type: DataTypes.TEXT, allowNull: false },
        createdAt: DataTypes.DATE,
      },
      { sequelize, tableName: 'run_comments', updatedAt: false },
    );
  }
}
