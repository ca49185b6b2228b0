'use strict';

// Certificates brought in from a program's earlier records keep the serial they were issued under
// (verification finds them by either serial) and say when they were imported.
/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(queryInterface, Sequelize) {
    await queryInterface.addColumn('certificates', 'legacySerial', { type: Sequelize.STRING(40), allowNull: true });
    await queryInterface.addColumn('certificates', 'importedAt', { type: Sequelize.DATE, allowNull: true });
    await queryInterface.addIndex('certificates', ['legacySerial'], { unique: true, name: 'certificates_legacy_serial' });
  },

  async down(queryInterface) {
    await queryInterface.removeIndex('certificates', 'certificates_legacy_serial');
    await queryInterface.removeColumn('certificates', 'importedAt');
    await queryInterface.removeColumn('certificates', 'legacySerial');
  },
};
