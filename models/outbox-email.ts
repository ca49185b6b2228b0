import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

export const OUTBOX_STATUSES = ['pending', 'sending', 'sent', 'failed'] as const;
export type OutboxStatus = (typeof OUTBOX_STATUSES)[number];

/** A message written in the same transaction as the change that causes it; a sender delivers it later. */
export class OutboxEmail extends Model<InferAttributes<OutboxEmail>, InferCreationAttributes<OutboxEmail>> {
  declare id: CreationOptional<number>;
  declare kind: string;
  declare toAddress: string;
  declare subject: string;
  declare textBody: string;
  declare htmlBody: string;
  declare attachments: CreationOptional<Record<string, unknown>[] | null>;
  declare status: CreationOptional<OutboxStatus>;
  declare attempts: CreationOptional<number>;
  declare nextAttemptAt: Date;
  declare lastError: CreationOptional<string | null>;
  declare claimedBy: CreationOptional<string | null>;
  declare claimedAt: CreationOptional<Date | null>;
  declare sentAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    OutboxEmail.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        kind: { type: DataTypes.STRING(60), allowNull: false },
        toAddress: { type: DataTypes.STRING(254), allowNull: false },
        subject: { type: DataTypes.STRING(300), allowNull: false },
        textBody: { type: DataTypes.TEXT, allowNull: false },
        htmlBody: { type: DataTypes.TEXT, allowNull: false },
        attachments: { type: DataTypes.JSON, allowNull: true },
        status: { type: DataTypes.ENUM(...OUTBOX_STATUSES), allowNull: false, defaultValue: 'pending' },
        attempts: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: false, defaultValue: 0 },
        nextAttemptAt: { type: DataTypes.DATE, allowNull: false },
        lastError: { type: DataTypes.STRING(1000), allowNull: true },
        claimedBy: { type: DataTypes.STRING(100), allowNull: true },
        claimedAt: { type: DataTypes.DATE, allowNull: true },
        sentAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, modelName: 'OutboxEmail', tableName: 'outbox_emails' },
    );
  }
}
