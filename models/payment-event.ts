import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** Each webhook event from the payment provider, stored once by its id. */
export class PaymentEvent extends Model<InferAttributes<PaymentEvent>, InferCreationAttributes<PaymentEvent>> {
  declare id: CreationOptional<number>;
  declare providerEventId: string;
  declare type: string;
  declare payload: unknown;
  declare processedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    PaymentEvent.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        providerEventId: { type: DataTypes.STRING(255), allowNull: false, unique: true },
        type: { type: DataTypes.STRING(100), allowNull: false },
        payload: { type: DataTypes.JSON, allowNull: false },
        processedAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, modelName: 'PaymentEvent', tableName: 'payment_events' },
    );
  }
}
