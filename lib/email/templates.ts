// Every message Brinewright sends, each with a plain-text and an HTML part. Pure functions: they
// build an OutgoingEmail for enqueueEmail() and do no I/O, so any module (and its tests) may call them.
import { formatMoney, formatWorkshopDate, formatWorkshopTimes } from '@/lib/enrollment/format';
import { formatDateTime } from '@/lib/local-time';
import { describeRoles, type Role } from '@/lib/roles';
import { STATE_NAME, batchName } from '@/lib/practicals/words';
import { RUBRIC_CRITERIA, type ReviewInput } from '@/lib/validations/practical';
import type { OutgoingAttachment, OutgoingEmail } from './outbox';

export type WorkshopFacts = { startsAt: Date | string; endsAt: Date | string; timeZone: string; place: string };

const esc = (s: string) => s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);
const iso = (d: Date | string) => (typeof d === 'string' ? d : d.toISOString());
const trimUrl = (u: string) => u.replace(/\/$/, '');

const SIGN_OFF = 'The Brinewright team';
const FOOTER =
  'Brinewright teaches and checks arithmetic; it never calls a recipe safe. Follow tested recipes from a recognised food-safety authority and your local guidance.';

type Block =
  { kind: 'p'; text: string } | { kind: 'facts'; rows: [string, string][] } | { kind: 'button'; label: string; href: string } | { kind: 'note'; text: string };

/** One layout for every message: the same blocks rendered as text and as simple, inline-styled HTML. */
function compose(kind: string, to: string, subject: string, greeting: string, blocks: Block[], attachments?: OutgoingAttachment[]): OutgoingEmail {
  const text = [
    greeting,
    '',
    ...blocks.flatMap((b) => {
      if (b.kind === 'p' || b.kind === 'note') return [b.text, ''];
      if (b.kind === 'facts') return [...b.rows.map(([k, v]) => `${k}: ${v}`), ''];
      return [`${b.label}: ${b.href}`, ''];
    }),
    SIGN_OFF,
    '',
    '--',
    FOOTER,
  ].join('\n');
  const html = `<!doctype html><html lang="en"><head><meta charset="utf-8"><title>${esc(subject)}</title></head>
<body style="margin:0;background:#f6f1e7;font-family:Georgia,'Times New Roman',serif;color:#23302b">
<div style="max-width:560px;margin:0 auto;padding:24px">
<p style="font-size:20px;font-weight:bold;color:#1f4d3f;margin:0 0 16px">Brinewright</p>
<div style="background:#ffffff;border:1px solid #d8d0bf;border-radius:12px;padding:24px">
<p style="margin:0 0 16px">${esc(greeting)}</p>
${blocks
  .map((b) => {
    if (b.kind === 'p') return `<p style="margin:0 0 16px;line-height:1.5">${esc(b.text)}</p>`;
    if (b.kind === 'note') return `<p style="margin:0 0 16px;font-size:14px;color:#5b6660">${esc(b.text)}</p>`;
    if (b.kind === 'facts')
      return `<table role="presentation" style="border-collapse:collapse;margin:0 0 16px">${b.rows
        .map(
          ([k, v]) =>
            `<tr><th scope="row" style="text-align:left;padding:4px 16px 4px 0;vertical-align:top">${esc(k)}</th><td style="padding:4px 0">${esc(v)}</td></tr>`,
        )
        .join('')}</table>`;
    return `<p style="margin:0 0 16px"><a href="${esc(b.href)}" style="display:inline-block;background:#b4572b;color:#ffffff;padding:10px 18px;border-radius:8px;text-decoration:none;font-weight:bold">${esc(b.label)}</a></p>`;
  })
  .join('\n')}
<p style="margin:0">${esc(SIGN_OFF)}</p>
</div>
<p style="font-size:12px;color:#5b6660;margin:16px 0 0">${esc(FOOTER)}</p>
</div></body></html>`;
  return { kind, to, subject, text, html, ...(attachments?.length ? { attachments } : {}) };
}

export type ProgramSignature = { name: string; contactEmail: string | null; contactPhone: string | null; postalAddress: string | null };

/** Signs a message with the program's own name and contact in place of the generic sign-off. */
export function signWith(message: OutgoingEmail, program: ProgramSignature): OutgoingEmail {
  const lines = [program.name, program.contactEmail, program.contactPhone, program.postalAddress].filter((l): l is string => Boolean(l));
  return {
    ...message,
    text: message.text.replace(`\n${SIGN_OFF}\n`, `\n${lines.join('\n')}\n`),
    html: message.html.replace(`<p style="margin:0">${esc(SIGN_OFF)}</p>`, `<p style="margin:0">${lines.map(esc).join('<br>')}</p>`),
  };
}

function workshopRows(workshop: WorkshopFacts | null | undefined): [string, string][] {
  if (!workshop) return [];
  return [
    ['Workshop', formatWorkshopDate(iso(workshop.startsAt), workshop.timeZone)],
    ['Time', formatWorkshopTimes(iso(workshop.startsAt), iso(workshop.endsAt), workshop.timeZone)],
    ['Place', workshop.place],
  ];
}

/** Sent at registration: welcome, and the link that confirms the e-mail address. */
export function welcomeEmail({ to, name, confirmUrl }: { to: string; name: string; confirmUrl: string }): OutgoingEmail {
  return compose('user.welcome', to, 'Welcome to Brinewright — please confirm your e-mail address', `Hello ${name},`, [
    {
      kind: 'p',
      text: 'Your Brinewright account is ready. Lessons, calculators and quizzes are waiting in your Pantry, and workshop dates are listed on each course page.',
    },
    { kind: 'p', text: 'Please confirm that this address is yours, so that receipts, workshop reminders and your certificate reach you:' },
    { kind: 'button', label: 'Confirm my e-mail address', href: confirmUrl },
    { kind: 'note', text: 'If you did not create this account, you can ignore this message; nothing more will be sent.' },
  ]);
}

/** Sent when an enrollment becomes active: what was paid (or waived), and where and when the workshop is. */
export function enrollmentReceiptEmail({
  to,
  name,
  courseTitle,
  workshop,
  amountCents,
  currency,
  waived,
  appUrl,
}: {
  to: string;
  name: string;
  courseTitle: string;
  workshop: WorkshopFacts | null;
  amountCents: number;
  currency: string;
  waived: boolean;
  appUrl: string;
}): OutgoingEmail {
  const paid = waived ? `${formatMoney(0, currency)} (course fee waived)` : formatMoney(amountCents, currency);
  return compose('enrollment.receipt', to, `You are enrolled: ${courseTitle}`, `Hello ${name},`, [
    { kind: 'p', text: `Your place in ${courseTitle} is confirmed. Keep this message as your receipt.` },
    { kind: 'facts', rows: [['Course', courseTitle], ['Amount paid', paid], ...workshopRows(workshop)] },
    { kind: 'p', text: 'Bring an apron and closed-toe shoes to the workshop; jars, produce and canners are provided.' },
    { kind: 'button', label: 'Open my Pantry', href: `${trimUrl(appUrl)}/pantry` },
  ]);
}

/** Sent when the coordinator refunds a course fee. */
export function refundEmail({
  to,
  name,
  courseTitle,
  workshop,
  amountCents,
  currency,
}: {
  to: string;
  name: string;
  courseTitle: string;
  workshop: WorkshopFacts | null;
  amountCents: number;
  currency: string;
}): OutgoingEmail {
  return compose('payment.refunded', to, `Refund issued: ${courseTitle}`, `Hello ${name},`, [
    { kind: 'p', text: `We have refunded your course fee for ${courseTitle}, and your workshop seat has been released.` },
    { kind: 'facts', rows: [['Refunded', formatMoney(amountCents, currency)], ...workshopRows(workshop)] },
    { kind: 'note', text: 'Refunds usually reach the card within 5 to 10 business days, depending on your bank.' },
  ]);
}

/** Sent to every coordinator when a paid checkout's amount or currency differs from the enrollment's fee. */
export function paymentMismatchEmail({
  to,
  name,
  learnerEmail,
  courseTitle,
  enrollmentId,
  paidCents,
  paidCurrency,
  feeCents,
  feeCurrency,
  appUrl,
}: {
  to: string;
  name: string;
  learnerEmail: string;
  courseTitle: string;
  enrollmentId: number;
  paidCents: number;
  paidCurrency: string;
  feeCents: number;
  feeCurrency: string;
  appUrl: string;
}): OutgoingEmail {
  return compose('payment.amount_mismatch', to, `Payment does not match the fee: enrollment ${enrollmentId}`, `Hello ${name},`, [
    {
      kind: 'p',
      text: `A card payment for ${courseTitle} arrived with a different amount or currency than the enrollment's fee, so the enrollment was not activated. Check the payment with the provider, then refund it or settle the difference.`,
    },
    {
      kind: 'facts',
      rows: [
        ['Learner', learnerEmail],
        ['Enrollment', String(enrollmentId)],
        ['Paid', formatMoney(paidCents, paidCurrency)],
        ['Fee', formatMoney(feeCents, feeCurrency)],
      ],
    },
    { kind: 'button', label: 'Open the Certificate desk', href: `${trimUrl(appUrl)}/desk` },
  ]);
}

/** Sent a day before a workshop. */
export function workshopReminderEmail({
  to,
  name,
  courseTitle,
  workshop,
  appUrl,
}: {
  to: string;
  name: string;
  courseTitle: string;
  workshop: WorkshopFacts;
  appUrl: string;
}): OutgoingEmail {
  return compose('workshop.reminder', to, `Tomorrow: your ${courseTitle} workshop`, `Hello ${name},`, [
    { kind: 'p', text: 'This is a reminder that your hands-on workshop is tomorrow.' },
    { kind: 'facts', rows: workshopRows(workshop) },
    {
      kind: 'p',
      text: 'Tie back long hair and bring an apron. If you live above 1,000 feet, note your altitude: the processing times you will practise depend on it.',
    },
    { kind: 'button', label: 'Review the lessons', href: `${trimUrl(appUrl)}/pantry` },
  ]);
}

/** Sent when an instructor has decided on a practical batch: the decision, the comment and the rubric. */
export function practicalReviewedEmail({
  to,
  name,
  courseTitle,
  round,
  review,
  reviewerName,
  url,
}: {
  to: string;
  name: string;
  courseTitle: string;
  round: number;
  review: ReviewInput;
  reviewerName: string;
  url: string;
}): OutgoingEmail {
  const approved = review.decision === 'approved';
  const rubric = RUBRIC_CRITERIA.map(({ id, label }): [string, string] => {
    const r = review.rubric[id];
    return [label, `${r.verdict === 'met' ? 'met' : 'not met'}${r.comment ? ` (${r.comment})` : ''}`];
  });
  return compose(
    'practical.reviewed',
    to,
    `${approved ? STATE_NAME.approved : STATE_NAME.changes_requested}: your practical batch for ${courseTitle}`,
    `Hello ${name},`,
    [
      {
        kind: 'p',
        text: approved
          ? `${reviewerName} looked at your ${batchName(round)} at the Tasting table, and it passed the table.`
          : `${reviewerName} looked at your ${batchName(round)} at the Tasting table and asks you for another batch before it can pass.`,
      },
      ...(review.comment ? [{ kind: 'p' as const, text: `${approved ? 'Comment' : 'For the next batch'}: ${review.comment}` }] : []),
      { kind: 'facts', rows: rubric },
      { kind: 'button', label: approved ? 'See the notes' : 'See the notes and send another batch', href: url },
    ],
  );
}

/** Sent when a certificate is issued (hook for the certificates feature); the PDF may be attached. */
export function certificateIssuedEmail({
  to,
  name,
  courseTitle,
  serial,
  validUntil,
  verifyUrl,
  pdf,
}: {
  to: string;
  name: string;
  courseTitle: string;
  serial: string;
  validUntil: Date;
  verifyUrl: string;
  pdf?: OutgoingAttachment;
}): OutgoingEmail {
  const until = new Intl.DateTimeFormat('en-US', { year: 'numeric', month: 'long', day: 'numeric', timeZone: 'UTC' }).format(validUntil);
  return compose(
    'certificate.issued',
    to,
    `Your certificate: ${courseTitle}`,
    `Hello ${name},`,
    [
      { kind: 'p', text: `Congratulations — you have completed ${courseTitle}, and the program coordinator has issued your certificate.` },
      {
        kind: 'facts',
        rows: [
          ['Serial', serial],
          ['Valid until', until],
        ],
      },
      { kind: 'p', text: 'Anyone can check the certificate by its serial on the verification page:' },
      { kind: 'button', label: 'Verify the certificate', href: verifyUrl },
    ],
    pdf ? [pdf] : undefined,
  );
}

/** Sent to the holder when the coordinator revokes a certificate, with the reason given. */
export function certificateRevokedEmail({
  to,
  name,
  courseTitle,
  serial,
  reason,
}: {
  to: string;
  name: string;
  courseTitle: string;
  serial: string;
  reason: string;
}): OutgoingEmail {
  return compose('certificate.revoked', to, `Certificate revoked: ${courseTitle}`, `Hello ${name},`, [
    { kind: 'p', text: `Your certificate ${serial} for ${courseTitle} has been revoked.` },
    { kind: 'facts', rows: [['Reason given', reason]] },
    { kind: 'p', text: 'Its verification page now shows it as revoked. Please contact the program coordinator with any questions.' },
  ]);
}

/** Sent to a certificate holder when a course's "what changed" record publishes new entries. */
export function courseChangesEmail({
  to,
  name,
  courseTitle,
  changes,
  changesUrl,
}: {
  to: string;
  name: string;
  courseTitle: string;
  changes: { date: string; summary: string; source: string }[];
  changesUrl: string;
}): OutgoingEmail {
  return compose('course.changes', to, `What changed in ${courseTitle}`, `Hello ${name},`, [
    {
      kind: 'p',
      text: `You hold a certificate for ${courseTitle}. ${changes.length === 1 ? 'One change to its safety figures or advice has' : `${changes.length} changes to its safety figures or advice have`} been published, so that volunteers teach from the current figures:`,
    },
    ...changes.map((c): Block => ({ kind: 'note', text: `${c.date}: ${c.summary} (Source: ${c.source})` })),
    { kind: 'button', label: 'Read what changed', href: changesUrl },
  ]);
}

/** Sent when someone asks to reset the password of an existing account: the single-use link. */
export function passwordResetEmail({ to, name, resetUrl, validMinutes }: { to: string; name: string; resetUrl: string; validMinutes: number }): OutgoingEmail {
  return compose('user.password_reset', to, 'Set a new Brinewright password', `Hello ${name},`, [
    { kind: 'p', text: 'Someone, probably you, asked to set a new password for your Brinewright account. Use this link to choose one:' },
    { kind: 'button', label: 'Choose a new password', href: resetUrl },
    { kind: 'note', text: `The link works once, for ${validMinutes} minutes. Setting a new password signs your account out everywhere.` },
    { kind: 'note', text: 'If you did not ask for this, ignore this message: your password stays as it is.' },
  ]);
}

/** Sent after a password was changed or reset, so the holder notices a change they did not make. */
export function passwordChangedEmail({ to, name, appUrl }: { to: string; name: string; appUrl: string }): OutgoingEmail {
  return compose('user.password_changed', to, 'Your Brinewright password was changed', `Hello ${name},`, [
    { kind: 'p', text: 'The password of your Brinewright account was just changed, and every session of the account was signed out.' },
    { kind: 'p', text: 'If you did not do this, reset your password now and tell the program coordinator:' },
    { kind: 'button', label: 'Reset my password', href: `${trimUrl(appUrl)}/forgot-password` },
  ]);
}

/** Sent to the new address of an e-mail change: nothing changes until this link is opened. */
export function emailChangeConfirmEmail({
  to,
  name,
  confirmUrl,
  validHours,
}: {
  to: string;
  name: string;
  confirmUrl: string;
  validHours: number;
}): OutgoingEmail {
  return compose('user.email_change', to, 'Confirm your new e-mail address for Brinewright', `Hello ${name},`, [
    { kind: 'p', text: 'You asked to use this address for your Brinewright account. Confirm it, and we will write to you here from then on:' },
    { kind: 'button', label: 'Use this e-mail address', href: confirmUrl },
    { kind: 'note', text: `The link works once, for ${validHours} hours. Until it is opened, your account keeps its present address.` },
  ]);
}

/** Sent to the present address when a change to another one is asked for. */
export function emailChangeNoticeEmail({ to, name, newEmail, appUrl }: { to: string; name: string; newEmail: string; appUrl: string }): OutgoingEmail {
  return compose('user.email_change_notice', to, 'A change of your Brinewright e-mail address was asked for', `Hello ${name},`, [
    { kind: 'p', text: `Someone signed in to your Brinewright account asked to move it to ${newEmail}. Nothing changes unless that address confirms.` },
    { kind: 'p', text: 'If this was not you, change your password now; that also signs the account out everywhere:' },
    { kind: 'button', label: 'Reset my password', href: `${trimUrl(appUrl)}/forgot-password` },
  ]);
}

/** Sent again on request: the link that confirms the account's e-mail address. */
export function confirmAddressEmail({ to, name, confirmUrl }: { to: string; name: string; confirmUrl: string }): OutgoingEmail {
  return compose('user.confirm_address', to, 'Confirm your e-mail address for Brinewright', `Hello ${name},`, [
    {
      kind: 'p',
      text: 'Here is a new link to confirm that this address is yours. Enrolling in a course and receiving a certificate need a confirmed address.',
    },
    { kind: 'button', label: 'Confirm my e-mail address', href: confirmUrl },
    { kind: 'note', text: 'The link works for seven days. If you did not ask for it, you can ignore this message.' },
  ]);
}

/** Sent when an admin invites a staff member: the roles, and the single-use link to choose a name and password. */
export function staffInvitationEmail({
  to,
  inviterName,
  programName,
  roles,
  acceptUrl,
  expiresAt,
  timeZone,
}: {
  to: string;
  inviterName: string;
  programName: string;
  roles: readonly Role[];
  acceptUrl: string;
  expiresAt: Date;
  timeZone: string;
}): OutgoingEmail {
  return compose('invitation.staff', to, `You are invited to ${programName} on Brinewright`, 'Hello,', [
    { kind: 'p', text: `${inviterName} invites you to join ${programName} on Brinewright as ${describeRoles(roles).toLowerCase()}.` },
    { kind: 'p', text: 'Open the link to choose your name and a password. It works once.' },
    { kind: 'button', label: 'Accept the invitation', href: acceptUrl },
    { kind: 'facts', rows: [['Link works until', formatDateTime(expiresAt, timeZone)]] },
    { kind: 'note', text: 'If you did not expect this invitation, you can ignore this message; no account is made until the link is used.' },
  ]);
}
