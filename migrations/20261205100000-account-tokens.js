'use strict';

// Accounts that recover: single-use links for a password reset and an e-mail change (only the
// SHA-256 of each token is stored, so a copy of the database opens no account), and the moment an
// account was erased at its holder's request (its row stays under a pseudonym for what must be kept).
/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(queryInterface, Sequelize) {
    await queryInterface.createTable(
      'account_tokens',
      {
        id: { type: Sequelize.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true, allowNull: false },
        userId: {
          type: Sequelize.INTEGER.UNSIGNED,
          allowNull: false,
          references: { model: 'users', key: 'id' },
          onUpdate: 'CASCADE',
          onDelete: 'CASCADE',
        },
        purpose: { type: Sequelize.ENUM('password_reset', 'email_change'), allowNull: false },
        tokenHash: { type: Sequelize.CHAR(64), allowNull: false, unique: true },
        newEmail: { type: Sequelize.STRING(254), allowNull: true },
        expiresAt: { type: Sequelize.DATE, allowNull: false },
        usedAt: { type: Sequelize.DATE, allowNull: true },
        createdAt: { type: Sequelize.DATE, allowNull: false },
        updatedAt: { type: Sequelize.DATE, allowNull: false },
      },
      { charset: 'utf8mb4', collate: 'utf8mb4_unicode_ci', engine: 'InnoDB' },
    );
    await queryInterface.addIndex('account_tokens', ['userId', 'purpose'], { name: 'account_tokens_user_purpose' });
    await queryInterface.addColumn('users', 'erasedAt', { type: Sequelize.DATE, allowNull: true });
  },
  async down(queryInterface) {
    await queryInterface.removeColumn('users', 'erasedAt');
    await queryInterface.dropTable('account_tokens');
  },
};
