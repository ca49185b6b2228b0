'use strict';

// Staff invitations: an admin invites an address with a set of roles; the invitee chooses a name and
// a password at the link. Only a SHA-256 hash of the link's token is kept. A second invitation to the
// same address replaces the first (replacedAt), so only the newest link works.
/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(queryInterface, Sequelize) {
    await queryInterface.createTable('staff_invitations', {
      id: { type: Sequelize.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true },
      email: { type: Sequelize.STRING(254), allowNull: false },
      roles: { type: "SET('learner','instructor','coordinator','admin')", allowNull: false },
      tokenHash: { type: Sequelize.CHAR(64), allowNull: false },
      invitedById: { type: Sequelize.INTEGER.UNSIGNED, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
      expiresAt: { type: Sequelize.DATE, allowNull: false },
      acceptedAt: { type: Sequelize.DATE, allowNull: true },
      acceptedUserId: { type: Sequelize.INTEGER.UNSIGNED, allowNull: true, references: { model: 'users', key: 'id' }, onDelete: 'SET NULL' },
      replacedAt: { type: Sequelize.DATE, allowNull: true },
      createdAt: { type: Sequelize.DATE, allowNull: false },
      updatedAt: { type: Sequelize.DATE, allowNull: false },
    });
    await queryInterface.addIndex('staff_invitations', ['tokenHash'], { unique: true, name: 'staff_invitations_token' });
    await queryInterface.addIndex('staff_invitations', ['email', 'createdAt']);
    await queryInterface.addIndex('staff_invitations', ['invitedById']);
    await queryInterface.addIndex('staff_invitations', ['acceptedUserId']);
  },
  async down(queryInterface) {
    await queryInterface.dropTable('staff_invitations');
  },
};
