import { DataTypes, Model, type CreationOptional, type ForeignKey, type InferAttributes, type InferCreationAttributes, type Sequelize } from 'sequelize';
import type { Practical } from './practical';
import type { User } from './user';

/** A re-encoded photo of a practical, kept in the storage module under `storageKey`. */
export class PracticalPhoto extends Model<InferAttributes<PracticalPhoto>, InferCreationAttributes<PracticalPhoto>> {
  declare id: CreationOptional<number>;
  declare practicalId: ForeignKey<Practical['id']> | null;
  declare userId: ForeignKey<User['id']>;
  declare storageKey: string;
  declare thumbnailKey: string;
  declare contentType: string;
  declare width: number;
  declare height: number;
  declare bytes: number;
  declare caption: CreationOptional<string | null>;
  declare createdAt: CreationOptional<Date>;
  declare updatedAt: CreationOptional<Date>;

  static initModel(sequelize: Sequelize) {
    PracticalPhoto.init(
      {
        id: { type: DataTypes.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
        storageKey: { type: DataTypes.STRING(200), allowNull: false, unique: true },
        thumbnailKey: { type: DataTypes.STRING(200), allowNull: false },
        contentType: { type: DataTypes.STRING(40), allowNull: false },
        width: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: false },
        height: { type: DataTypes.SMALLINT.UNSIGNED, allowNull: false },
        bytes: { type: DataTypes.INTEGER.UNSIGNED, allowNull: false },
        caption: { type: DataTypes.STRING(200), allowNull: true },
        createdAt: DataTypes.DATE,
        updatedAt: DataTypes.DATE,
      },
      { sequelize, modelName: 'PracticalPhoto', tableName: 'practical_photos' },
    );
  }
}
