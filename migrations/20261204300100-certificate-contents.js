'use strict';

// What an issued certificate says is stored with it, so a later change of a name, a course title
// or the program's name never rewrites it. A correction is a reissue: the earlier wording moves to
// certificate_versions under its own serial, which verification still finds (as replaced).
/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(queryInterface, Sequelize) {
    const text = (length, allowNull = true) => ({ type: Sequelize.STRING(length), allowNull });
    await queryInterface.addColumn('certificates', 'holderName', text(120));
    await queryInterface.addColumn('certificates', 'courseTitle', text(200));
    await queryInterface.addColumn('certificates', 'programName', text(200));
    await queryInterface.addColumn('certificates', 'signerName', text(120));
    await queryInterface.addColumn('certificates', 'signerTitle', text(120));
    await queryInterface.addColumn('certificates', 'version', { type: Sequelize.SMALLINT.UNSIGNED, allowNull: false, defaultValue: 1 });
    // Certificates issued before this migration said what the live rows say today: keep that.
    await queryInterface.sequelize.query(
      `UPDATE certificates ce JOIN users u ON u.id = ce.userId JOIN enrollments e ON e.id = ce.enrollmentId JOIN courses c ON c.id = e.courseId
          LEFT JOIN users s ON s.id = ce.issuedById
          SET ce.holderName = u.name, ce.courseTitle = c.title, ce.programName = ?,
              ce.signerName = CASE WHEN s.role IN ('coordinator', 'admin') THEN s.name END,
              ce.signerTitle = CASE WHEN s.role IN ('coordinator', 'admin') THEN 'Program coordinator' END`,
      { replacements: [process.env.CERTIFICATE_PROGRAM_NAME || 'Cedar Hollow County home-preserving program'] },
    );
    for (const [column, length] of [
      ['holderName', 120],
      ['courseTitle', 200],
      ['programName', 200],
    ]) {
      await queryInterface.changeColumn('certificates', column, text(length, false));
    }

    await queryInterface.createTable(
      'certificate_versions',
      {
        id: { type: Sequelize.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true, allowNull: false },
        certificateId: {
          type: Sequelize.INTEGER.UNSIGNED,
          allowNull: false,
          references: { model: 'certificates', key: 'id' },
          onUpdate: 'CASCADE',
          onDelete: 'CASCADE',
        },
        version: { type: Sequelize.SMALLINT.UNSIGNED, allowNull: false },
        serial: { type: Sequelize.STRING(32), allowNull: false, unique: true },
        holderName: text(120, false),
        courseTitle: text(200, false),
        programName: text(200, false),
        signerName: text(120),
        signerTitle: text(120),
        issuedAt: { type: Sequelize.DATE, allowNull: false },
        validUntil: { type: Sequelize.DATE, allowNull: false },
        replacedAt: { type: Sequelize.DATE, allowNull: false },
        replacedById: {
          type: Sequelize.INTEGER.UNSIGNED,
          allowNull: true,
          references: { model: 'users', key: 'id' },
          onUpdate: 'CASCADE',
          onDelete: 'SET NULL',
        },
        reason: text(500, false),
        createdAt: { type: Sequelize.DATE, allowNull: false },
        updatedAt: { type: Sequelize.DATE, allowNull: false },
      },
      { charset: 'utf8mb4', collate: 'utf8mb4_unicode_ci', engine: 'InnoDB' },
    );
    await queryInterface.addIndex('certificate_versions', ['certificateId', 'version'], { unique: true });
    await queryInterface.addIndex('certificate_versions', ['replacedById']);
  },

  async down(queryInterface) {
    await queryInterface.dropTable('certificate_versions');
    for (const column of ['version', 'signerTitle', 'signerName', 'programName', 'courseTitle', 'holderName'])
      await queryInterface.removeColumn('certificates', column);
  },
};
