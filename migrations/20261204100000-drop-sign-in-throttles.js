'use strict';

// Sign-in attempts are counted in rate_limits with every other throttle (lib/throttle.ts); the
// older table of failures per account or address is no longer read.
/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(queryInterface) {
    await queryInterface.dropTable('sign_in_throttles');
  },

  async down(queryInterface, Sequelize) {
    await queryInterface.createTable(
      'sign_in_throttles',
      {
        id: { type: Sequelize.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true, allowNull: false },
        bucket: { type: Sequelize.STRING(300), allowNull: false, unique: true },
        failures: { type: Sequelize.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
        windowStartedAt: { type: Sequelize.DATE, allowNull: false },
        createdAt: { type: Sequelize.DATE, allowNull: false },
        updatedAt: { type: Sequelize.DATE, allowNull: false },
      },
      { charset: 'utf8mb4', collate: 'utf8mb4_unicode_ci', engine: 'InnoDB' },
    );
  },
};
