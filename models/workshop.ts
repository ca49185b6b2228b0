import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { Course } from './course';
import type { User } from './user';

/** A dated, in-person session of a course. Times are stored in UTC with the place's time zone beside them. */
export class Workshop extends Model<InferAttributes<Workshop>, InferCreationAttributes<Workshop>> {
  declare id: CreationOptional<number>;
  declare courseId: ForeignKey<Course['id']>;
  declare instructorId: ForeignKey<User['id']> | null;
  declare startsAt: Date;
  declare endsAt: Date;
  declare timeZone: string;
  declare place: string;
  declare seats: number;
  declare attendanceRequired: CreationOptional<boolean>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Workshop.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        startsAt: { type: DataTypes.DATE, allowNull: false },
        endsAt: { type: DataTypes.DATE, allowNull: false },
        timeZone: { type: DataTypes.STRING(64), allowNull: false },
        place: { type: DataTypes.STRING(300), allowNull: false },
        seats: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: false },
        attendanceRequired: { type: DataTypes.BOOLEAN, allowNull: false, defaultValue: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, modelName: 'Workshop', tableName: 'workshops' },
    );
  }
}
