'use strict';

// The Tasting table filters and sorts by "flagged or not" and by age; a count of the automatic
// flags kept beside the JSON list makes both an indexed query.
/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(queryInterface, Sequelize) {
    await queryInterface.addColumn('practicals', 'flagCount', { type: Sequelize.SMALLINT.UNSIGNED, allowNull: false, defaultValue: 0 });
    await queryInterface.addIndex('practicals', ['flagCount', 'submittedAt'], { name: 'practicals_flag_count_submitted_at' });
    await queryInterface.addIndex('practicals', ['submittedAt'], { name: 'practicals_submitted_at' });
  },

  async down(queryInterface) {
    await queryInterface.removeIndex('practicals', 'practicals_submitted_at');
    await queryInterface.removeIndex('practicals', 'practicals_flag_count_submitted_at');
    await queryInterface.removeColumn('practicals', 'flagCount');
  },
};
