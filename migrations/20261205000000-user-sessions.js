'use strict';

// Sessions that end: a session token carries the user's sessionVersion from sign-in, and the guard
// refuses a token whose version is no longer the user's (a password change or reset, "sign out
// everywhere", deactivation bump it). A deactivated account cannot sign in; its records stay.
/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(queryInterface, Sequelize) {
    await queryInterface.addColumn('users', 'sessionVersion', { type: Sequelize.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 });
    await queryInterface.addColumn('users', 'deactivatedAt', { type: Sequelize.DATE, allowNull: true });
  },
  async down(queryInterface) {
    await queryInterface.removeColumn('users', 'deactivatedAt');
    await queryInterface.removeColumn('users', 'sessionVersion');
  },
};
