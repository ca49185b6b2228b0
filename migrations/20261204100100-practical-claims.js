'use strict';

// An instructor who is neither the workshop's nor a coordinator claims a submission before
// deciding on it; one claimant at a time.
/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(queryInterface, Sequelize) {
    await queryInterface.addColumn('practicals', 'claimedById', { type: Sequelize.INTEGER.UNSIGNED, allowNull: true });
    await queryInterface.addColumn('practicals', 'claimedAt', { type: Sequelize.DATE, allowNull: true });
    await queryInterface.addIndex('practicals', ['claimedById'], { name: 'practicals_claimed_by_id' });
    await queryInterface.addConstraint('practicals', {
      type: 'foreign key',
      name: 'practicals_claimed_by_fk',
      fields: ['claimedById'],
      references: { table: 'users', field: 'id' },
      onUpdate: 'CASCADE',
      onDelete: 'SET NULL',
    });
  },

  async down(queryInterface) {
    await queryInterface.removeConstraint('practicals', 'practicals_claimed_by_fk');
    await queryInterface.removeIndex('practicals', 'practicals_claimed_by_id');
    await queryInterface.removeColumn('practicals', 'claimedAt');
    await queryInterface.removeColumn('practicals', 'claimedById');
  },
};
