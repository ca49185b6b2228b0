import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { Course } from './course';
import type { User } from './user';

/** A code from the coordinator that skips the course fee, with a number of uses and an expiry. */
export class FeeWaiver extends Model<InferAttributes<FeeWaiver>, InferCreationAttributes<FeeWaiver>> {
  declare id: CreationOptional<number>;
  declare code: string;
  declare courseId: ForeignKey<Course['id']> | null;
  declare createdById: ForeignKey<User['id']> | null;
  declare maxUses: number;
  declare uses: CreationOptional<number>;
  declare expiresAt: Date;
  declare note: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    FeeWaiver.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        code: { type: DataTypes.STRING(40), allowNull: false, unique: true },
        maxUses: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: false },
        uses: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: false, defaultValue: 0 },
        expiresAt: { type: DataTypes.DATE, allowNull: false },
        note: { type: DataTypes.STRING(300), allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, modelName: 'FeeWaiver', tableName: 'fee_waivers' },
    );
  }
}
