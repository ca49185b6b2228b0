'use strict';

// The audit log viewer lists entries newest first, filtered by kind of action and by date
// (by person: the existing actorId index).
/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(queryInterface) {
    await queryInterface.addIndex('audit_logs', ['createdAt'], { name: 'audit_logs_created_at' });
    await queryInterface.addIndex('audit_logs', ['action', 'createdAt'], { name: 'audit_logs_action_created_at' });
  },
  async down(queryInterface) {
    await queryInterface.removeIndex('audit_logs', 'audit_logs_action_created_at');
    await queryInterface.removeIndex('audit_logs', 'audit_logs_created_at');
  },
};
