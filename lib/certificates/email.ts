import type { OutgoingEmail } from '@/lib/email/outbox';

const formatDate = (date: Date) => new Intl.DateTimeFormat('en-US', { dateStyle: 'long', timeZone: 'UTC' }).format(date);
const escapeHtml = (s: string) => s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);

export function certificateIssuedEmail(input: {
  to: string;
  learnerName: string;
  courseTitle: string;
  programName: string;
  serial: string;
  validUntil: Date;
  verifyUrl: string;
  pdf: Uint8Array;
}): OutgoingEmail {
  const text = [
    `Dear ${input.learnerName},`,
    '',
    `Congratulations: the ${input.programName} has issued your certificate for "${input.courseTitle}".`,
    `Serial: ${input.serial}`,
    `Valid until: ${formatDate(input.validUntil)}`,
    '',
    'The certificate is attached as a PDF, and you can download it again from your Pantry.',
    `Anyone can check it at ${input.verifyUrl}`,
    '',
    'The certificate records the training you completed. It does not certify any recipe or product as safe:',
    'keep following tested recipes, local codes and licensed practice.',
  ].join('\n');
  const html = `<p>Dear ${escapeHtml(input.learnerName)},</p>
<p>Congratulations: the ${escapeHtml(input.programName)} has issued your certificate for <strong>${escapeHtml(input.courseTitle)}</strong>.</p>
<p>Serial: <strong>${escapeHtml(input.serial)}</strong><br>Valid until: ${formatDate(input.validUntil)}</p>
<p>The certificate is attached as a PDF, and you can download it again from your Pantry. Anyone can check it at <a href="${escapeHtml(input.verifyUrl)}">${escapeHtml(input.verifyUrl)}</a>.</p>
<p>The certificate records the training you completed. It does not certify any recipe or product as safe: keep following tested recipes, local codes and licensed practice.</p>`;
  return {
    kind: 'certificate.issued',
    to: input.to,
    subject: `Your certificate: ${input.courseTitle}`,
    text,
    html,
    attachments: [{ filename: `certificate-${input.serial}.pdf`, contentType: 'application/pdf', contentBase64: Buffer.from(input.pdf).toString('base64') }],
  };
}

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
