import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { Course } from './course';
import type { User } from './user';

/** One sitting of a quiz: the drawn order, the answers and the grade. */
export class QuizAttempt extends Model<InferAttributes<QuizAttempt>, InferCreationAttributes<QuizAttempt>> {
  declare id: CreationOptional<number>;
  declare userId: ForeignKey<User['id']>;
  declare courseId: ForeignKey<Course['id']>;
  declare quizSlug: string;
  declare drawn: unknown;
  declare answers: CreationOptional<Record<string, unknown> | null>;
  declare scorePct: CreationOptional<number | null>;
  declare passed: CreationOptional<boolean | null>;
  declare startedAt: Date;
  declare deadlineAt: CreationOptional<Date | null>;
  declare submittedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    QuizAttempt.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        quizSlug: { type: DataTypes.STRING(120), allowNull: false },
        drawn: { type: DataTypes.JSON, allowNull: false },
        answers: { type: DataTypes.JSON, allowNull: true },
        scorePct: { type: DataTypes.DECIMAL(5, 2), allowNull: true },
        passed: { type: DataTypes.BOOLEAN, allowNull: true },
        startedAt: { type: DataTypes.DATE, allowNull: false },
        deadlineAt: { type: DataTypes.DATE, allowNull: true },
        submittedAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, modelName: 'QuizAttempt', tableName: 'quiz_attempts' },
    );
  }
}
