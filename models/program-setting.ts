import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { User } from './user';

/** The program's identity (one row, id 1), set on the admin's program page. */
export class ProgramSetting extends Model<InferAttributes<ProgramSetting>, InferCreationAttributes<ProgramSetting>> {
  declare id: number;
  declare name: string;
  declare shortName: string;
  declare contactEmail: string | null;
  declare contactPhone: string | null;
  declare postalAddress: string | null;
  declare timeZone: string;
  declare logoKey: CreationOptional<string | null>;
  declare updatedById: ForeignKey<User['id']> | null;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    ProgramSetting.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, primaryKey: true },
        name: { type: DataTypes.STRING(200), allowNull: false },
        shortName: { type: DataTypes.STRING(40), allowNull: false },
        contactEmail: { type: DataTypes.STRING(254), allowNull: true },
        contactPhone: { type: DataTypes.STRING(40), allowNull: true },
        postalAddress: { type: DataTypes.STRING(500), allowNull: true },
        timeZone: { type: DataTypes.STRING(64), allowNull: false },
        logoKey: { type: DataTypes.STRING(200), allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, modelName: 'ProgramSetting', tableName: 'program_settings' },
    );
  }
}
