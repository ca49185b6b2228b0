'use strict';

// An enrollment is held to the requirements in force when it began: it keeps the course content
// version of that day (every enrollment before this change began under version 1). The notices
// table records each published "what changed" entry whose e-mail went out, so it goes out once.
/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(queryInterface, Sequelize) {
    await queryInterface.addColumn('enrollments', 'contentVersion', { type: Sequelize.SMALLINT.UNSIGNED, allowNull: false, defaultValue: 1 });
    await queryInterface.createTable('change_notices', {
      id: { type: Sequelize.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
      changeId: { type: Sequelize.STRING(120), allowNull: false },
      courseSlug: { type: Sequelize.STRING(80), allowNull: false },
      recipients: { type: Sequelize.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
      createdAt: { type: Sequelize.DATE, allowNull: false },
    });
    await queryInterface.addIndex('change_notices', ['changeId'], { name: 'change_notices_change_id', unique: true });
  },

  async down(queryInterface) {
    await queryInterface.dropTable('change_notices');
    await queryInterface.removeColumn('enrollments', 'contentVersion');
  },
};
