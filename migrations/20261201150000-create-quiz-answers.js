'use strict';

// One row per question of a graded quiz attempt, so the question results for instructors come from
// one aggregated query rather than from unpacking JSON per attempt.

/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(queryInterface, Sequelize) {
    await queryInterface.createTable(
      'quiz_answers',
      {
        id: { type: Sequelize.BIGINT.UNSIGNED, autoIncrement: true, primaryKey: true, allowNull: false },
        attemptId: {
          type: Sequelize.INTEGER.UNSIGNED,
          allowNull: false,
          references: { model: 'quiz_attempts', key: 'id' },
          onUpdate: 'CASCADE',
          onDelete: 'CASCADE',
        },
        courseId: {
          type: Sequelize.INTEGER.UNSIGNED,
          allowNull: false,
          references: { model: 'courses', key: 'id' },
          onUpdate: 'CASCADE',
          onDelete: 'RESTRICT',
        },
        workshopId: {
          type: Sequelize.INTEGER.UNSIGNED,
          allowNull: true,
          references: { model: 'workshops', key: 'id' },
          onUpdate: 'CASCADE',
          onDelete: 'SET NULL',
        },
        quizSlug: { type: Sequelize.STRING(120), allowNull: false },
        questionId: { type: Sequelize.STRING(120), allowNull: false },
        correct: { type: Sequelize.BOOLEAN, allowNull: false },
        response: { type: Sequelize.STRING(200), allowNull: true },
        submittedAt: { type: Sequelize.DATE, allowNull: false },
      },
      { charset: 'utf8mb4', collate: 'utf8mb4_unicode_ci', engine: 'InnoDB' },
    );
    await queryInterface.addIndex('quiz_answers', ['attemptId', 'questionId'], { unique: true, name: 'quiz_answers_once' });
    await queryInterface.addIndex('quiz_answers', ['quizSlug', 'submittedAt']);
    await queryInterface.addIndex('quiz_answers', ['workshopId', 'submittedAt']);
  },

  async down(queryInterface) {
    await queryInterface.dropTable('quiz_answers');
  },
};
