'use strict';

// An account holds a set of roles (a volunteer instructor is also a learner; a coordinator may also
// teach): MariaDB's SET column replaces the single `role`, so the guard still reads one user row.
// Down keeps the most senior role of each set.
const ROLES = ['learner', 'instructor', 'coordinator', 'admin'];

/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(queryInterface) {
    await queryInterface.sequelize.query(
      `ALTER TABLE users ADD COLUMN roles SET(${ROLES.map((r) => `'${r}'`).join(', ')}) NOT NULL DEFAULT 'learner' AFTER passwordHash`,
    );
    await queryInterface.sequelize.query('UPDATE users SET roles = role');
    await queryInterface.removeIndex('users', ['role']);
    await queryInterface.removeColumn('users', 'role');
  },
  async down(queryInterface, Sequelize) {
    await queryInterface.addColumn('users', 'role', { type: Sequelize.ENUM(...ROLES), allowNull: false, defaultValue: 'learner' });
    await queryInterface.sequelize.query(
      `UPDATE users SET role = CASE
         WHEN FIND_IN_SET('admin', roles) THEN 'admin'
         WHEN FIND_IN_SET('coordinator', roles) THEN 'coordinator'
         WHEN FIND_IN_SET('instructor', roles) THEN 'instructor'
         ELSE 'learner' END`,
    );
    await queryInterface.addIndex('users', ['role']);
    await queryInterface.removeColumn('users', 'roles');
  },
};
