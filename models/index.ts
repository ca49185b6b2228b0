import type { Sequelize } from 'sequelize';
import { getSequelize } from '@/lib/db';
import { AccountToken } from './account-token';
import { AuditLog } from './audit-log';
import { Certificate } from './certificate';
import { CertificateVersion } from './certificate-version';
import { Course } from './course';
import { Enrollment } from './enrollment';
import { FeeWaiver } from './fee-waiver';
import { LessonProgress } from './lesson-progress';
import { OutboxEmail } from './outbox-email';
import { Payment } from './payment';
import { PaymentEvent } from './payment-event';
import { Practical } from './practical';
import { PracticalPhoto } from './practical-photo';
import { ProgramSetting } from './program-setting';
import { QuizAnswer } from './quiz-answer';
import { QuizAttempt } from './quiz-attempt';
import { Review } from './review';
import { StaffInvitation } from './staff-invitation';
import { User } from './user';
import { Workshop } from './workshop';

// An explicit registry: the bundler can follow these imports, unlike a readdir + require loop.
const registry = {
  AccountToken,
  AuditLog,
  Certificate,
  CertificateVersion,
  Course,
  Enrollment,
  FeeWaiver,
  LessonProgress,
  OutboxEmail,
  Payment,
  PaymentEvent,
  Practical,
  PracticalPhoto,
  ProgramSetting,
  QuizAnswer,
  QuizAttempt,
  Review,
  StaffInvitation,
  User,
  Workshop,
};

export type Models = typeof registry;

function associate() {
  const fk = (name: string, allowNull = false) => ({ name, allowNull });
  Workshop.belongsTo(Course, { foreignKey: fk('courseId'), as: 'course' });
  Workshop.belongsTo(User, { foreignKey: fk('instructorId', true), as: 'instructor' });
  Course.hasMany(Workshop, { foreignKey: fk('courseId'), as: 'workshops' });

  Enrollment.belongsTo(User, { foreignKey: fk('userId'), as: 'user' });
  Enrollment.belongsTo(Course, { foreignKey: fk('courseId'), as: 'course' });
  Enrollment.belongsTo(Workshop, { foreignKey: fk('workshopId', true), as: 'workshop' });
  Enrollment.belongsTo(FeeWaiver, { foreignKey: fk('feeWaiverId', true), as: 'feeWaiver' });
  User.hasMany(Enrollment, { foreignKey: fk('userId'), as: 'enrollments' });
  Workshop.hasMany(Enrollment, { foreignKey: fk('workshopId', true), as: 'enrollments' });

  LessonProgress.belongsTo(User, { foreignKey: fk('userId'), as: 'user' });
  LessonProgress.belongsTo(Course, { foreignKey: fk('courseId'), as: 'course' });

  QuizAttempt.belongsTo(User, { foreignKey: fk('userId'), as: 'user' });
  QuizAttempt.belongsTo(Course, { foreignKey: fk('courseId'), as: 'course' });
  QuizAttempt.hasMany(QuizAnswer, { foreignKey: fk('attemptId'), as: 'answerRows' });
  QuizAnswer.belongsTo(QuizAttempt, { foreignKey: fk('attemptId'), as: 'attempt' });
  QuizAnswer.belongsTo(Course, { foreignKey: fk('courseId'), as: 'course' });
  QuizAnswer.belongsTo(Workshop, { foreignKey: fk('workshopId', true), as: 'workshop' });

  Practical.belongsTo(Enrollment, { foreignKey: fk('enrollmentId'), as: 'enrollment' });
  Practical.belongsTo(User, { foreignKey: fk('userId'), as: 'user' });
  Practical.hasMany(PracticalPhoto, { foreignKey: fk('practicalId', true), as: 'photos' });
  Practical.hasMany(Review, { foreignKey: fk('practicalId'), as: 'reviews' });
  PracticalPhoto.belongsTo(Practical, { foreignKey: fk('practicalId', true), as: 'practical' });
  PracticalPhoto.belongsTo(User, { foreignKey: fk('userId'), as: 'user' });
  Review.belongsTo(Practical, { foreignKey: fk('practicalId'), as: 'practical' });
  Review.belongsTo(User, { foreignKey: fk('reviewerId'), as: 'reviewer' });

  StaffInvitation.belongsTo(User, { foreignKey: fk('invitedById', true), as: 'invitedBy' });
  StaffInvitation.belongsTo(User, { foreignKey: fk('acceptedUserId', true), as: 'acceptedUser' });

  Certificate.belongsTo(Enrollment, { foreignKey: fk('enrollmentId'), as: 'enrollment' });
  Certificate.belongsTo(User, { foreignKey: fk('userId'), as: 'user' });
  Certificate.belongsTo(User, { foreignKey: fk('issuedById', true), as: 'issuedBy' });
  Enrollment.hasOne(Certificate, { foreignKey: fk('enrollmentId'), as: 'certificate' });
  CertificateVersion.belongsTo(Certificate, { foreignKey: fk('certificateId'), as: 'certificate' });
  CertificateVersion.belongsTo(User, { foreignKey: fk('replacedById', true), as: 'replacedBy' });

  Payment.belongsTo(Enrollment, { foreignKey: fk('enrollmentId'), as: 'enrollment' });
  Enrollment.hasMany(Payment, { foreignKey: fk('enrollmentId'), as: 'payments' });

  FeeWaiver.belongsTo(Course, { foreignKey: fk('courseId', true), as: 'course' });
  FeeWaiver.belongsTo(User, { foreignKey: fk('createdById', true), as: 'createdBy' });

  AuditLog.belongsTo(User, { foreignKey: fk('actorId', true), as: 'actor' });
  AccountToken.belongsTo(User, { foreignKey: fk('userId'), as: 'user' });
}

declare global {
  var __brinewrightModels: { sequelize: Sequelize; models: Models } | undefined;
}

/** Initialises every model once on the given (or the app's) Sequelize instance. */
export function initModels(sequelize: Sequelize = getSequelize()): Models {
  if (globalThis.__brinewrightModels?.sequelize === sequelize) return globalThis.__brinewrightModels.models;
  for (const model of Object.values(registry)) model.initModel(sequelize);
  associate();
  globalThis.__brinewrightModels = { sequelize, models: registry };
  return registry;
}

/** The models, bound to the app's database. */
export function db(): Models & { sequelize: Sequelize } {
  const models = initModels();
  return { ...models, sequelize: globalThis.__brinewrightModels!.sequelize };
}

export {
  AccountToken,
  AuditLog,
  Certificate,
  Course,
  Enrollment,
  FeeWaiver,
  LessonProgress,
  OutboxEmail,
  Payment,
  PaymentEvent,
  Practical,
  PracticalPhoto,
  QuizAnswer,
  QuizAttempt,
  Review,
  StaffInvitation,
  User,
  Workshop,
};
