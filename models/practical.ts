import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { Enrollment } from './enrollment';
import type { User } from './user';

export const PRACTICAL_STATUSES = ['submitted', 'changes_requested', 'approved'] as const;
export type PracticalStatus = (typeof PRACTICAL_STATUSES)[number];

/** One round of a learner's photographed batch; a resubmission is a new round. */
export class Practical extends Model<InferAttributes<Practical>, InferCreationAttributes<Practical>> {
  declare id: CreationOptional<number>;
  declare enrollmentId: ForeignKey<Enrollment['id']>;
  declare userId: ForeignKey<User['id']>;
  declare round: number;
  declare status: CreationOptional<PracticalStatus>;
  declare details: unknown;
  declare flags: CreationOptional<Record<string, unknown>[]>;
  declare flagCount: CreationOptional<number>;
  declare submittedAt: Date;
  declare claimedById: CreationOptional<number | null>;
  declare claimedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Practical.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        round: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: false },
        status: { type: DataTypes.ENUM(...PRACTICAL_STATUSES), allowNull: false, defaultValue: 'submitted' },
        details: { type: DataTypes.JSON, allowNull: false },
        flags: { type: DataTypes.JSON, allowNull: false, defaultValue: [] },
        flagCount: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: false, defaultValue: 0 },
        submittedAt: { type: DataTypes.DATE, allowNull: false },
        claimedById: { type: DataTypes.INTEGER.UNSIGNED, allowNull: true },
        claimedAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, modelName: 'Practical', tableName: 'practicals' },
    );
  }
}
