// The issue e-mail is lib/email/templates.ts certificateIssuedEmail (shared templates); the
// revocation notice, which has no shared template, is written here.
import type { OutgoingEmail } from '@/lib/email/outbox';

const escapeHtml = (s: string) => s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

export function certificateRevokedEmail(input: { to: string; learnerName: string; courseTitle: string; serial: string; reason: string }): OutgoingEmail {
  const text = [
    `Dear ${input.learnerName},`,
    '',
    `Your certificate ${input.serial} for "${input.courseTitle}" has been revoked.`,
    `Reason given: ${input.reason}`,
    '',
    'Its verification page now shows it as revoked. Please contact the program coordinator with any questions.',
  ].join('\n');
  const html = `<p>Dear ${escapeHtml(input.learnerName)},</p>
<p>Your certificate <strong>${escapeHtml(input.serial)}</strong> for <strong>${escapeHtml(input.courseTitle)}</strong> has been revoked.</p>
<p>Reason given: ${escapeHtml(input.reason)}</p>
<p>Its verification page now shows it as revoked. Please contact the program coordinator with any questions.</p>`;
  return { kind: 'certificate.revoked', to: input.to, subject: `Certificate revoked: ${input.courseTitle}`, text, html };
}
