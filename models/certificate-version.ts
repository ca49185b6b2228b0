import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import { WORDING_ATTRIBUTES, type Certificate } from './certificate';
import type { User } from './user';

/** What a certificate said before a reissue corrected it, under its old serial. Rows are only ever added. */
export class CertificateVersion extends Model<InferAttributes<CertificateVersion>, InferCreationAttributes<CertificateVersion>> {
  declare id: CreationOptional<number>;
  declare certificateId: ForeignKey<Certificate['id']>;
  declare version: number;
  declare serial: string;
  declare holderName: string;
  declare courseTitle: string;
  declare programName: string;
  declare signerName: string | null;
  declare signerTitle: string | null;
  declare issuedAt: Date;
  declare validUntil: Date;
  declare replacedAt: Date;
  declare replacedById: ForeignKey<User['id']> | null;
  declare reason: string;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    CertificateVersion.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        version: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: false },
        serial: { type: DataTypes.STRING(32), allowNull: false, unique: true },
        ...WORDING_ATTRIBUTES,
        issuedAt: { type: DataTypes.DATE, allowNull: false },
        validUntil: { type: DataTypes.DATE, allowNull: false },
        replacedAt: { type: DataTypes.DATE, allowNull: false },
        reason: { type: DataTypes.STRING(500), allowNull: false },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, modelName: 'CertificateVersion', tableName: 'certificate_versions' },
    );
  }
}
