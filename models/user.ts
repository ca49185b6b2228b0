import { DataTypes, Model, type CreationOptional, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import { formatRoles, parseRoles, type Role } from '@/lib/roles';

export class User extends Model<InferAttributes<User>, InferCreationAttributes<User>> {
  declare id: CreationOptional<number>;
  declare email: string;
  declare name: string;
  declare passwordHash: string;
  /** The roles the account holds (MariaDB SET column; read and written as an array). */
  declare roles: CreationOptional<Role[]>;
  declare emailVerifiedAt: CreationOptional<Date | null>;
  declare sessionVersion: CreationOptional<number>;
  declare deactivatedAt: CreationOptional<Date | null>;
  declare erasedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    User.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        email: { type: DataTypes.STRING(254), allowNull: false, unique: true },
        name: { type: DataTypes.STRING(120), allowNull: false },
        passwordHash: { type: DataTypes.STRING(100), allowNull: false },
        roles: {
          type: DataTypes.STRING,
          allowNull: false,
          defaultValue: 'learner',
          get(this: User) {
            return parseRoles(this.getDataValue('roles'));
          },
          set(this: User, value: Role[]) {
            this.setDataValue('roles', formatRoles(value) as unknown as Role[]);
          },
        },
        emailVerifiedAt: { type: DataTypes.DATE, allowNull: true },
        sessionVersion: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
        deactivatedAt: { type: DataTypes.DATE, allowNull: true },
        erasedAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, modelName: 'User', tableName: 'users' },
    );
  }
}
