'use strict';

// Indexes for the Tasting table (lib/practicals/data.ts): its page query walks one of these in the
// order of the sort and stops after the page, and its per-status counts read the index only (no row
// reads, no sort of whole rows), for the filters and sorts the table offers:
// - (status, flagCount DESC, submittedAt): a status tab sorted by flags (most flags first, then
//   oldest), and the counts per status;
// - (flagCount DESC, submittedAt, status): "flagged"/"not flagged" with any sort, the flags sort on
//   all statuses, and the counts under those filters. It takes the place of the ascending
//   (flagCount, submittedAt) index, which it makes redundant.
// Descending index parts need MariaDB 10.8 or later (the project runs 10.11).
/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(queryInterface) {
    await queryInterface.addIndex('practicals', ['status', { name: 'flagCount', order: 'DESC' }, 'submittedAt'], { name: 'practicals_tasting_status' });
    await queryInterface.addIndex('practicals', [{ name: 'flagCount', order: 'DESC' }, 'submittedAt', 'status'], { name: 'practicals_tasting_flags' });
    await queryInterface.removeIndex('practicals', 'practicals_flag_count_submitted_at');
  },

  async down(queryInterface) {
    await queryInterface.addIndex('practicals', ['flagCount', 'submittedAt'], { name: 'practicals_flag_count_submitted_at' });
    await queryInterface.removeIndex('practicals', 'practicals_tasting_flags');
    await queryInterface.removeIndex('practicals', 'practicals_tasting_status');
  },
};
