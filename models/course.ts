import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';

/** The database's record of a course whose text lives in content/courses/<slug>.mdx. */
export class Course extends Model<InferAttributes<Course>, InferCreationAttributes<Course>> {
  declare id: CreationOptional<number>;
  declare slug: string;
  declare title: string;
  declare feeCents: number;
  declare currency: string;
  declare passMarkPct: CreationOptional<number>;
  declare validityMonths: CreationOptional<number>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Course.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        slug: { type: DataTypes.STRING(80), allowNull: false, unique: true },
        title: { type: DataTypes.STRING(200), allowNull: false },
        feeCents: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
        currency: { type: DataTypes.CHAR(3), allowNull: false, defaultValue: 'usd' },
        passMarkPct: { type: DataTypes.TINYINT.UNSIGNED, allowNull: false, defaultValue: 80 },
        validityMonths: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: false, defaultValue: 36 },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, modelName: 'Course', tableName: 'courses' },
    );
  }
}
