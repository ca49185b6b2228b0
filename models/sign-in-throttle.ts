import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** Failed sign-ins counted per key ('account:<email>' or 'address:<ip>') in a window, shared by every app server. */
export class SignInThrottle extends Model<InferAttributes<SignInThrottle>, InferCreationAttributes<SignInThrottle>> {
  declare id: CreationOptional<number>;
  declare bucket: string;
  declare failures: number;
  declare windowStartedAt: Date;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    SignInThrottle.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        bucket: { type: DataTypes.STRING(300), allowNull: false, unique: true },
        failures: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
        windowStartedAt: { type: DataTypes.DATE, allowNull: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, modelName: 'SignInThrottle', tableName: 'sign_in_throttles' },
    );
  }
}
