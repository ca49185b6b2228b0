'use strict';

/** @type {import('sequelize-cli').Migration} */
module.exports = {
  async up(queryInterface, Sequelize) {
    const id = { type: Sequelize.INTEGER.UNSIGNED, autoIncrement: true, primaryKey: true, allowNull: false };
    const stamps = {
      createdAt: { type: Sequelize.DATE, allowNull: false },
      updatedAt: { type: Sequelize.DATE, allowNull: false },
    };
    const ref = (table, allowNull = false, onDelete = 'RESTRICT') => ({
      type: Sequelize.INTEGER.UNSIGNED,
      allowNull,
      references: { model: table, key: 'id' },
      onUpdate: 'CASCADE',
      onDelete: allowNull && onDelete === 'RESTRICT' ? 'SET NULL' : onDelete,
    });
    const options = { charset: 'utf8mb4', collate: 'utf8mb4_unicode_ci', engine: 'InnoDB' };

    await queryInterface.createTable(
      'users',
      {
        id,
        email: { type: Sequelize.STRING(254), allowNull: false, unique: true },
        name: { type: Sequelize.STRING(120), allowNull: false },
        passwordHash: { type: Sequelize.STRING(100), allowNull: false },
        role: { type: Sequelize.ENUM('learner', 'instructor', 'coordinator', 'admin'), allowNull: false, defaultValue: 'learner' },
        emailVerifiedAt: { type: Sequelize.DATE, allowNull: true },
        ...stamps,
      },
      options,
    );
    await queryInterface.addIndex('users', ['role']);

    await queryInterface.createTable(
      'courses',
      {
        id,
        slug: { type: Sequelize.STRING(80), allowNull: false, unique: true },
        title: { type: Sequelize.STRING(200), allowNull: false },
        feeCents: { type: Sequelize.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
        currency: { type: Sequelize.CHAR(3), allowNull: false, defaultValue: 'usd' },
        passMarkPct: { type: Sequelize.TINYINT.UNSIGNED, allowNull: false, defaultValue: 80 },
        validityMonths: { type: Sequelize.SMALLINT.UNSIGNED, allowNull: false, defaultValue: 36 },
        ...stamps,
      },
      options,
    );

    await queryInterface.createTable(
      'workshops',
      {
        id,
        courseId: ref('courses'),
        instructorId: ref('users', true),
        startsAt: { type: Sequelize.DATE, allowNull: false },
        endsAt: { type: Sequelize.DATE, allowNull: false },
        timeZone: { type: Sequelize.STRING(64), allowNull: false },
        place: { type: Sequelize.STRING(300), allowNull: false },
        seats: { type: Sequelize.SMALLINT.UNSIGNED, allowNull: false },
        attendanceRequired: { type: Sequelize.BOOLEAN, allowNull: false, defaultValue: true },
        ...stamps,
      },
      options,
    );
    await queryInterface.addIndex('workshops', ['courseId', 'startsAt']);
    await queryInterface.addIndex('workshops', ['instructorId']);

    await queryInterface.createTable(
      'fee_waivers',
      {
        id,
        code: { type: Sequelize.STRING(40), allowNull: false, unique: true },
        courseId: ref('courses', true),
        createdById: ref('users', true),
        maxUses: { type: Sequelize.SMALLINT.UNSIGNED, allowNull: false },
        uses: { type: Sequelize.SMALLINT.UNSIGNED, allowNull: false, defaultValue: 0 },
        expiresAt: { type: Sequelize.DATE, allowNull: false },
        note: { type: Sequelize.STRING(300), allowNull: true },
        ...stamps,
      },
      options,
    );
    await queryInterface.addIndex('fee_waivers', ['courseId']);
    await queryInterface.addIndex('fee_waivers', ['createdById']);

    await queryInterface.createTable(
      'enrollments',
      {
        id,
        userId: ref('users'),
        courseId: ref('courses'),
        workshopId: ref('workshops', true),
        feeWaiverId: ref('fee_waivers', true),
        runKey: { type: Sequelize.STRING(40), allowNull: false },
        status: {
          type: Sequelize.ENUM('awaiting_payment', 'active', 'completed', 'withdrawn'),
          allowNull: false,
          defaultValue: 'awaiting_payment',
        },
        feeCents: { type: Sequelize.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
        attendedAt: { type: Sequelize.DATE, allowNull: true },
        completedAt: { type: Sequelize.DATE, allowNull: true },
        ...stamps,
      },
      options,
    );
    await queryInterface.addIndex('enrollments', ['userId', 'courseId', 'runKey'], { unique: true, name: 'enrollments_one_per_run' });
    await queryInterface.addIndex('enrollments', ['courseId', 'status']);
    await queryInterface.addIndex('enrollments', ['workshopId', 'status']);
    await queryInterface.addIndex('enrollments', ['feeWaiverId']);

    await queryInterface.createTable(
      'lesson_progress',
      {
        id,
        userId: ref('users', false, 'CASCADE'),
        courseId: ref('courses'),
        lessonSlug: { type: Sequelize.STRING(120), allowNull: false },
        readAt: { type: Sequelize.DATE, allowNull: false },
        ...stamps,
      },
      options,
    );
    await queryInterface.addIndex('lesson_progress', ['userId', 'courseId', 'lessonSlug'], { unique: true, name: 'lesson_progress_once' });
    await queryInterface.addIndex('lesson_progress', ['courseId']);

    await queryInterface.createTable(
      'quiz_attempts',
      {
        id,
        userId: ref('users', false, 'CASCADE'),
        courseId: ref('courses'),
        quizSlug: { type: Sequelize.STRING(120), allowNull: false },
        drawn: { type: Sequelize.JSON, allowNull: false },
        answers: { type: Sequelize.JSON, allowNull: true },
        scorePct: { type: Sequelize.DECIMAL(5, 2), allowNull: true },
        passed: { type: Sequelize.BOOLEAN, allowNull: true },
        startedAt: { type: Sequelize.DATE, allowNull: false },
        deadlineAt: { type: Sequelize.DATE, allowNull: true },
        submittedAt: { type: Sequelize.DATE, allowNull: true },
        ...stamps,
      },
      options,
    );
    await queryInterface.addIndex('quiz_attempts', ['userId', 'quizSlug', 'startedAt']);
    await queryInterface.addIndex('quiz_attempts', ['courseId', 'quizSlug', 'submittedAt']);

    await queryInterface.createTable(
      'practicals',
      {
        id,
        enrollmentId: ref('enrollments'),
        userId: ref('users'),
        round: { type: Sequelize.SMALLINT.UNSIGNED, allowNull: false },
        status: { type: Sequelize.ENUM('submitted', 'changes_requested', 'approved'), allowNull: false, defaultValue: 'submitted' },
        details: { type: Sequelize.JSON, allowNull: false },
        flags: { type: Sequelize.JSON, allowNull: false },
        submittedAt: { type: Sequelize.DATE, allowNull: false },
        ...stamps,
      },
      options,
    );
    await queryInterface.addIndex('practicals', ['enrollmentId', 'round'], { unique: true, name: 'practicals_one_per_round' });
    await queryInterface.addIndex('practicals', ['userId']);
    await queryInterface.addIndex('practicals', ['status', 'submittedAt']);

    await queryInterface.createTable(
      'practical_photos',
      {
        id,
        practicalId: ref('practicals', true, 'CASCADE'),
        userId: ref('users'),
        storageKey: { type: Sequelize.STRING(200), allowNull: false, unique: true },
        thumbnailKey: { type: Sequelize.STRING(200), allowNull: false },
        contentType: { type: Sequelize.STRING(40), allowNull: false },
        width: { type: Sequelize.SMALLINT.UNSIGNED, allowNull: false },
        height: { type: Sequelize.SMALLINT.UNSIGNED, allowNull: false },
        bytes: { type: Sequelize.INTEGER.UNSIGNED, allowNull: false },
        caption: { type: Sequelize.STRING(200), allowNull: true },
        ...stamps,
      },
      options,
    );
    await queryInterface.addIndex('practical_photos', ['practicalId']);
    await queryInterface.addIndex('practical_photos', ['userId']);

    await queryInterface.createTable(
      'reviews',
      {
        id,
        practicalId: ref('practicals', false, 'CASCADE'),
        reviewerId: ref('users'),
        decision: { type: Sequelize.ENUM('approved', 'changes_requested'), allowNull: false },
        rubric: { type: Sequelize.JSON, allowNull: false },
        comment: { type: Sequelize.TEXT, allowNull: true },
        ...stamps,
      },
      options,
    );
    await queryInterface.addIndex('reviews', ['practicalId']);
    await queryInterface.addIndex('reviews', ['reviewerId']);

    await queryInterface.createTable(
      'certificates',
      {
        id,
        enrollmentId: { ...ref('enrollments'), unique: true },
        userId: ref('users'),
        issuedById: ref('users', true),
        serial: { type: Sequelize.STRING(32), allowNull: false, unique: true },
        issuedAt: { type: Sequelize.DATE, allowNull: false },
        validUntil: { type: Sequelize.DATE, allowNull: false },
        revokedAt: { type: Sequelize.DATE, allowNull: true },
        revokeReason: { type: Sequelize.STRING(500), allowNull: true },
        ...stamps,
      },
      options,
    );
    await queryInterface.addIndex('certificates', ['userId']);
    await queryInterface.addIndex('certificates', ['issuedById']);
    await queryInterface.addIndex('certificates', ['issuedAt']);

    await queryInterface.createTable(
      'payments',
      {
        id,
        enrollmentId: ref('enrollments'),
        provider: { type: Sequelize.STRING(20), allowNull: false, defaultValue: 'stripe' },
        checkoutSessionId: { type: Sequelize.STRING(255), allowNull: false, unique: true },
        paymentIntentId: { type: Sequelize.STRING(255), allowNull: true },
        amountCents: { type: Sequelize.INTEGER.UNSIGNED, allowNull: false },
        currency: { type: Sequelize.CHAR(3), allowNull: false },
        status: { type: Sequelize.ENUM('pending', 'paid', 'expired', 'refunded'), allowNull: false, defaultValue: 'pending' },
        refundedCents: { type: Sequelize.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
        paidAt: { type: Sequelize.DATE, allowNull: true },
        ...stamps,
      },
      options,
    );
    await queryInterface.addIndex('payments', ['enrollmentId']);
    await queryInterface.addIndex('payments', ['paymentIntentId']);

    await queryInterface.createTable(
      'payment_events',
      {
        id,
        providerEventId: { type: Sequelize.STRING(255), allowNull: false, unique: true },
        type: { type: Sequelize.STRING(100), allowNull: false },
        payload: { type: Sequelize.JSON, allowNull: false },
        processedAt: { type: Sequelize.DATE, allowNull: true },
        ...stamps,
      },
      options,
    );

    await queryInterface.createTable(
      'outbox_emails',
      {
        id,
        kind: { type: Sequelize.STRING(60), allowNull: false },
        toAddress: { type: Sequelize.STRING(254), allowNull: false },
        subject: { type: Sequelize.STRING(300), allowNull: false },
        textBody: { type: Sequelize.TEXT, allowNull: false },
        htmlBody: { type: Sequelize.TEXT, allowNull: false },
        attachments: { type: Sequelize.JSON, allowNull: true },
        status: { type: Sequelize.ENUM('pending', 'sending', 'sent', 'failed'), allowNull: false, defaultValue: 'pending' },
        attempts: { type: Sequelize.SMALLINT.UNSIGNED, allowNull: false, defaultValue: 0 },
        nextAttemptAt: { type: Sequelize.DATE, allowNull: false },
        lastError: { type: Sequelize.STRING(1000), allowNull: true },
        claimedBy: { type: Sequelize.STRING(100), allowNull: true },
        claimedAt: { type: Sequelize.DATE, allowNull: true },
        sentAt: { type: Sequelize.DATE, allowNull: true },
        ...stamps,
      },
      options,
    );
    await queryInterface.addIndex('outbox_emails', ['status', 'nextAttemptAt']);

    await queryInterface.createTable(
      'audit_logs',
      {
        id: { type: Sequelize.BIGINT.UNSIGNED, autoIncrement: true, primaryKey: true, allowNull: false },
        actorId: ref('users', true),
        action: { type: Sequelize.STRING(80), allowNull: false },
        subjectType: { type: Sequelize.STRING(60), allowNull: false },
        subjectId: { type: Sequelize.STRING(60), allowNull: false },
        data: { type: Sequelize.JSON, allowNull: true },
        ...stamps,
      },
      options,
    );
    await queryInterface.addIndex('audit_logs', ['actorId']);
    await queryInterface.addIndex('audit_logs', ['subjectType', 'subjectId']);

    await queryInterface.createTable(
      'sign_in_throttles',
      {
        id,
        bucket: { type: Sequelize.STRING(300), allowNull: false, unique: true },
        failures: { type: Sequelize.INTEGER.UNSIGNED, allowNull: false, defaultValue: 0 },
        windowStartedAt: { type: Sequelize.DATE, allowNull: false },
        ...stamps,
      },
      options,
    );
  },

  async down(queryInterface) {
    for (const table of [
      'sign_in_throttles',
      'audit_logs',
      'outbox_emails',
      'payment_events',
      'payments',
      'certificates',
      'reviews',
      'practical_photos',
      'practicals',
      'quiz_attempts',
      'lesson_progress',
      'enrollments',
      'fee_waivers',
      'workshops',
      'courses',
      'users',
    ]) {
      await queryInterface.dropTable(table);
    }
  },
};
