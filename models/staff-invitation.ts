import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import { formatRoles, parseRoles, type Role } from '@/lib/roles';
import type { User } from './user';

/** An admin's invitation of a staff member by e-mail, with the roles the account will hold. */
export class StaffInvitation extends Model<InferAttributes<StaffInvitation>, InferCreationAttributes<StaffInvitation>> {
  declare id: CreationOptional<number>;
  declare email: string;
  declare roles: Role[];
  /** SHA-256 (hex) of the link's token; the token itself is only in the e-mail. */
  declare tokenHash: string;
  declare invitedById: ForeignKey<User['id']> | null;
  declare expiresAt: Date;
  declare acceptedAt: CreationOptional<Date | null>;
  declare acceptedUserId: ForeignKey<User['id']> | null;
  declare replacedAt: CreationOptional<Date | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    StaffInvitation.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        email: { type: DataTypes.STRING(254), allowNull: false },
        roles: {
          type: DataTypes.STRING,
          allowNull: false,
          get(this: StaffInvitation) {
            return parseRoles(this.getDataValue('roles'));
          },
          set(this: StaffInvitation, value: Role[]) {
            this.setDataValue('roles', formatRoles(value) as unknown as Role[]);
          },
        },
        tokenHash: { type: DataTypes.CHAR(64), allowNull: false, unique: true },
        expiresAt: { type: DataTypes.DATE, allowNull: false },
        acceptedAt: { type: DataTypes.DATE, allowNull: true },
        replacedAt: { type: DataTypes.DATE, allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, modelName: 'StaffInvitation', tableName: 'staff_invitations' },
    );
  }
}
