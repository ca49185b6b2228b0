// The audit log's action codes in plain words, for the viewer. A code without words here (a new
// one) is still shown, spelled out from its code, so nothing in the log is hidden.

const WORDS: Record<string, string> = {
  'certificate.imported': 'imported a certificate',
  'certificate.issued': 'issued a certificate',
  'certificate.reissued': 'reissued a certificate',
  'certificate.revoked': 'revoked a certificate',
  'enrollment.created': 'enrolled',
  'enrollment.awaiting_payment': 'held a seat until payment',
  'enrollment.active': 'made an enrollment active',
  'enrollment.completed': 'completed an enrollment',
  'enrollment.withdrawn': 'withdrew an enrollment',
  'invitation.sent': 'sent a staff invitation',
  'invitation.accepted': 'accepted a staff invitation',
  'payment.amount_mismatch': 'received a payment of the wrong amount',
  'payment.needs_refund': 'marked a payment for refund',
  'payment.paid': 'received a payment',
  'payment.refunded': 'refunded a payment',
  'practical.approved': 'approved a practical',
  'practical.changes_requested': 'asked for changes to a practical',
  'practical.claimed': 'claimed a practical',
  'practical.released': 'released a practical',
  'practical.submitted': 'submitted a practical',
  'program.settings_saved': 'saved the program settings',
  'user.admin_created': 'made the first admin',
  'user.deactivated': 'deactivated an account',
  'user.email_confirmed': 'confirmed an e-mail address',
  'user.reactivated': 'reactivated an account',
  'user.registered': 'registered',
  'user.roles_changed': 'changed the roles of an account',
  'waiver.created': 'created a fee waiver code',
  'workshop.created': 'added a workshop',
  'workshop.reminder_queued': 'queued workshop reminders',
  'workshop.updated': 'changed a workshop',
};

/** "changed the roles of an account"; an unknown code "user.something_new" reads "user: something new". */
export function actionWords(action: string): string {
  return WORDS[action] ?? action.replace('.', ': ').replace(/_/g, ' ');
}

/** Every action with words, for the filter's list (with any others the log holds). */
export function knownActions(): string[] {
  return Object.keys(WORDS);
}

const SUBJECTS: Record<string, string> = {
  certificate: 'Certificate',
  enrollment: 'Enrollment',
  fee_waiver: 'Fee waiver',
  invitation: 'Invitation',
  payment: 'Payment',
  practical: 'Practical',
  program: 'Program settings',
  user: 'Account',
  workshop: 'Workshop',
};

/** "Enrollment 42" */
export function subjectWords(type: string, id: string): string {
  const name = SUBJECTS[type] ?? type.replace(/_/g, ' ');
  return type === 'program' ? name : `${name} ${id}`;
}
