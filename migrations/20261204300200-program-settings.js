'use strict';

// The program's own identity, set by an admin: one row (id 1). Without it the app falls back to
// CERTIFICATE_PROGRAM_NAME.
/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(queryInterface, Sequelize) {
    const text = (length) => ({ type: Sequelize.STRING(length), allowNull: true });
    await queryInterface.createTable(
      'program_settings',
      {
        id: { type: Sequelize.INTEGER.UNSIGNED, primaryKey: true, allowNull: false },
        name: { type: Sequelize.STRING(200), allowNull: false },
        shortName: { type: Sequelize.STRING(40), allowNull: false },
        contactEmail: text(254),
        contactPhone: text(40),
        postalAddress: text(500),
        timeZone: { type: Sequelize.STRING(64), allowNull: false },
        logoKey: text(200),
        updatedById: {
          type: Sequelize.INTEGER.UNSIGNED,
          allowNull: true,
          references: { model: 'users', key: 'id' },
          onUpdate: 'CASCADE',
          onDelete: 'SET NULL',
        },
        createdAt: { type: Sequelize.DATE, allowNull: false },
        updatedAt: { type: Sequelize.DATE, allowNull: false },
      },
      { charset: 'utf8mb4', collate: 'utf8mb4_unicode_ci', engine: 'InnoDB' },
    );
    await queryInterface.addIndex('program_settings', ['updatedById']);
  },

  async down(queryInterface) {
    await queryInterface.dropTable('program_settings');
  },
};
