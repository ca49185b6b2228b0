'use strict';

/**
 * Request counters per bucket and time window (lib/rate-limit.ts), kept in MariaDB so that every
 * app server sees the same count. The public certificate check uses buckets `verify:<address>`.
 */
/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(queryInterface, Sequelize) {
    await queryInterface.createTable(
      'rate_limits',
      {
        id: { type: Sequelize.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true, allowNull: false },
        bucket: { type: Sequelize.STRING(200), allowNull: false, unique: true },
        hits: { type: Sequelize.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
        windowStartedAt: { type: Sequelize.DATE, allowNull: false },
        createdAt: { type: Sequelize.DATE, allowNull: false },
        updatedAt: { type: Sequelize.DATE, allowNull: false },
      },
      { charset: 'utf8mb4', collate: 'utf8mb4_unicode_ci', engine: 'InnoDB' },
    );
    await queryInterface.addIndex('rate_limits', ['windowStartedAt']);
  },

  async down(queryInterface) {
    await queryInterface.dropTable('rate_limits');
  },
};
