import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { User } from './user';

/** Who did what to which record, and when. Rows are only ever added. */
export class AuditLog extends Model<InferAttributes<AuditLog>, InferCreationAttributes<AuditLog>> {
  declare id: CreationOptional<number>;
  declare actorId: ForeignKey<User['id']> | null;
  declare action: string;
  declare subjectType: string;
  declare subjectId: string;
  declare data: CreationOptional<Record<string, unknown> | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    AuditLog.init(
      {
        id: { type: DataTypes.BIGINT.UNSIGNED, autoIncrement: true, primaryKey: true },
        action: { type: DataTypes.STRING(80), allowNull: false },
        subjectType: { type: DataTypes.STRING(60), allowNull: false },
        subjectId: { type: DataTypes.STRING(60), allowNull: false },
        data: { type: DataTypes.JSON, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, modelName: 'AuditLog', tableName: 'audit_logs' },
    );
  }
}
