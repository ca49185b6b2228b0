import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { Practical } from './practical';
import type { User } from './user';

export const REVIEW_DECISIONS = ['approved', 'changes_requested'] as const;
export type ReviewDecision = (typeof REVIEW_DECISIONS)[number];

/** An instructor's rubric and decision on one round of a practical. */
export class Review extends Model<InferAttributes<Review>, InferCreationAttributes<Review>> {
  declare id: CreationOptional<number>;
  declare practicalId: ForeignKey<Practical['id']>;
  declare reviewerId: ForeignKey<User['id']>;
  declare decision: ReviewDecision;
  declare rubric: unknown;
  declare comment: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Review.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        decision: { type: DataTypes.ENUM(...REVIEW_DECISIONS), allowNull: false },
        rubric: { type: DataTypes.JSON, allowNull: false },
        comment: { type: DataTypes.TEXT, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, modelName: 'Review', tableName: 'reviews' },
    );
  }
}
