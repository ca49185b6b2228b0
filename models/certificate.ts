import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { Enrollment } from './enrollment';
import type { User } from './user';

/** A completion certificate: at most one per enrollment, found by its serial. */
export class Certificate extends Model<InferAttributes<Certificate>, InferCreationAttributes<Certificate>> {
  declare id: CreationOptional<number>;
  declare enrollmentId: ForeignKey<Enrollment['id']>;
  declare userId: ForeignKey<User['id']>;
  declare issuedById: ForeignKey<User['id']> | null;
  declare serial: string;
  declare issuedAt: Date;
  declare validUntil: Date;
  declare revokedAt: CreationOptional<Date | null>;
  declare revokeReason: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    Certificate.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        enrollmentId: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false, unique: true },
        serial: { type: DataTypes.STRING(32), allowNull: false, unique: true },
        issuedAt: { type: DataTypes.DATE, allowNull: false },
        validUntil: { type: DataTypes.DATE, allowNull: false },
        revokedAt: { type: DataTypes.DATE, allowNull: true },
        revokeReason: { type: DataTypes.STRING(500), allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, modelName: 'Certificate', tableName: 'certificates' },
    );
  }
}
