import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { Enrollment } from './enrollment';

export const PAYMENT_STATUSES = ['pending', 'paid', 'expired', 'refunded'] as const;
export type PaymentStatus = (typeof PAYMENT_STATUSES)[number];

/** A course fee collected (or being collected) through the payment provider. Money in integer cents. */
export class Payment extends Model<InferAttributes<Payment>, InferCreationAttributes<Payment>> {
  declare id: CreationOptional<number>;
  declare enrollmentId: ForeignKey<Enrollment['id']>;
  declare provider: CreationOptional<string>;
  declare checkoutSessionId: string;
  declare paymentIntentId: CreationOptional<string | null>;
  declare amountCents: number;
  declare currency: string;
  declare status: CreationOptional<PaymentStatus>;
  declare refundedCents: CreationOptional<number>;
  declare paidAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Payment.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        provider: { type: DataTypes.STRING(20), allowNull: false, defaultValue: 'stripe' },
        checkoutSessionId: { type: DataTypes.STRING(255), allowNull: false, unique: true },
        paymentIntentId: { type: DataTypes.STRING(255), allowNull: true },
        amountCents: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        currency: { type: DataTypes.CHAR(3), allowNull: false },
        status: { type: DataTypes.ENUM(...PAYMENT_STATUSES), allowNull: false, defaultValue: 'pending' },
        refundedCents: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
        paidAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, modelName: 'Payment', tableName: 'payments' },
    );
  }
}
