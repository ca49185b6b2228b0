import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import { ENROLLMENT_STATUSES, type EnrollmentStatus } from '@/lib/enrollment-status';
import type { Course } from './course';
import type { User } from './user';
import type { Workshop } from './workshop';
import type { FeeWaiver } from './fee-waiver';

/**
 * A learner's place in one run of a course. `runKey` is the workshop id, or
 * 'self-paced' for a course taken without a workshop, so that the unique
 * (userId, courseId, runKey) holds even where workshopId is NULL.
 */
export class Enrollment extends Model<InferAttributes<Enrollment>, InferCreationAttributes<Enrollment>> {
  declare id: CreationOptional<number>;
  declare userId: ForeignKey<User['id']>;
  declare courseId: ForeignKey<Course['id']>;
  declare workshopId: ForeignKey<Workshop['id']> | null;
  declare feeWaiverId: ForeignKey<FeeWaiver['id']> | null;
  declare runKey: string;
  declare status: CreationOptional<EnrollmentStatus>;
  declare feeCents: number;
  /** The course content version the enrollment began under; its requirements are that version's. */
  declare contentVersion: CreationOptional<number>;
  declare attendedAt: CreationOptional<Date | null>;
  declare completedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Enrollment.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        runKey: { type: DataTypes.STRING(40), allowNull: false },
        status: { type: DataTypes.ENUM(...ENROLLMENT_STATUSES), allowNull: false, defaultValue: 'awaiting_payment' },
        feeCents: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
        contentVersion: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: false, defaultValue: 1 },
        attendedAt: { type: DataTypes.DATE, allowNull: true },
        completedAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, modelName: 'Enrollment', tableName: 'enrollments' },
    );
  }
}
