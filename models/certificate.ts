import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { Enrollment } from './enrollment';
import type { User } from './user';

/** The columns of what a certificate says, shared with its earlier versions (certificate_versions). */
export const WORDING_ATTRIBUTES = {
  holderName: { type: DataTypes.STRING(120), allowNull: false },
  courseTitle: { type: DataTypes.STRING(200), allowNull: false },
  programName: { type: DataTypes.STRING(200), allowNull: false },
  signerName: { type: DataTypes.STRING(120), allowNull: true },
  signerTitle: { type: DataTypes.STRING(120), allowNull: true },
} as const;

/** A completion certificate: at most one per enrollment, found by its serial. */
export class Certificate extends Model<InferAttributes<Certificate>, InferCreationAttributes<Certificate>> {
  declare id: CreationOptional<number>;
  declare enrollmentId: ForeignKey<Enrollment['id']>;
  declare userId: ForeignKey<User['id']>;
  declare issuedById: ForeignKey<User['id']> | null;
  declare serial: string;
  /** What the certificate says, stored at issue and changed only by a reissue. */
  declare holderName: string;
  declare courseTitle: string;
  declare programName: string;
  declare signerName: CreationOptional<string | null>;
  declare signerTitle: CreationOptional<string | null>;
  declare version: CreationOptional<number>;
  /** The serial an imported certificate had in the program's earlier records; verification accepts it too. */
  declare legacySerial: CreationOptional<string | null>;
  declare importedAt: CreationOptional<Date | null>;
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
        ...WORDING_ATTRIBUTES,
        version: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: false, defaultValue: 1 },
        legacySerial: { type: DataTypes.STRING(40), allowNull: true, unique: true },
        importedAt: { type: DataTypes.DATE, allowNull: true },
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
