'use strict';

// Demo data only: the invented Cedar Hollow County program's identity.
/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(queryInterface) {
    const now = new Date();
    const [[admin]] = await queryInterface.sequelize.query("SELECT id FROM users WHERE email = 'admin@cedarhollow.example'");
    await queryInterface.bulkInsert('program_settings', [
      {
        id: 1,
        name: 'Cedar Hollow County home-preserving program',
        shortName: 'Cedar Hollow Preserving',
        contactEmail: 'preserving@cedarhollow.example',
        contactPhone: '(555) 010-4471',
        postalAddress: 'Cedar Hollow County Extension Office, 14 Mill Road, Cedar Hollow',
        timeZone: 'America/Denver',
        logoKey: null,
        updatedById: admin ? admin.id : null,
        createdAt: now,
        updatedAt: now,
      },
    ]);
  },

  async down(queryInterface) {
    await queryInterface.bulkDelete('program_settings', { id: 1 });
  },
};
