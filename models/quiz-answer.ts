import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { Course } from './course';
import type { QuizAttempt } from './quiz-attempt';
import type { Workshop } from './workshop';

/** One graded answer of a submitted attempt, kept for the per-question results. */
export class QuizAnswer extends Model<InferAttributes<QuizAnswer>, InferCreationAttributes<QuizAnswer>> {
  declare id: CreationOptional<number>;
  declare attemptId: ForeignKey<QuizAttempt['id']>;
  declare courseId: ForeignKey<Course['id']>;
  declare workshopId: ForeignKey<Workshop['id']> | null;
  declare quizSlug: string;
  declare questionId: string;
  declare correct: boolean;
  declare response: string | null;
  declare submittedAt: Date;

  static initModel(sequelize: Sequelize) {
    QuizAnswer.init(
      {
        id: { type: DataTypes.BIGINT.UNSIGNED, autoIncrement: true, primaryKey: true },
        quizSlug: { type: DataTypes.STRING(120), allowNull: false },
        questionId: { type: DataTypes.STRING(120), allowNull: false },
        correct: { type: DataTypes.BOOLEAN, allowNull: false },
        response: { type: DataTypes.STRING(200), allowNull: true },
        submittedAt: { type: DataTypes.DATE, allowNull: false },
      },
      // The table has no createdAt/updatedAt: submittedAt is the row's one date.
      { sequelize, modelName: 'QuizAnswer', tableName: 'quiz_answers', timestamps: false },
    );
  }
}
