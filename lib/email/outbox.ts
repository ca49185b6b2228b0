import 'server-only';
import type { Transaction } from 'sequelize';
import { getProgramIdentity } from '@/lib/program/settings';
import { db } from '@/models';
import { signWith } from './templates';

export type OutgoingAttachment = { filename: string; contentType: string; contentBase64: string };

export type OutgoingEmail = {
  /** What caused it, e.g. 'enrollment.receipt', 'practical.reviewed', 'certificate.issued'. */
  kind: string;
  to: string;
  subject: string;
  text: string;
  html: string;
  attachments?: OutgoingAttachment[];
};

/**
 * Writes a message to the outbox. Call it inside the same transaction as the change that causes it,
 * so the message exists exactly when the change does; the sender delivers it later.
 */
export async function enqueueEmail(unsigned: OutgoingEmail, options: { transaction?: Transaction } = {}): Promise<number> {
  // Every message is signed by the program (its settings page, or CERTIFICATE_PROGRAM_NAME).
  const message = signWith(unsigned, await getProgramIdentity({ transaction: options.transaction }));
  const row = await db().OutboxEmail.create(
    {
      kind: message.kind,
      toAddress: message.to,
      subject: message.subject,
      textBody: message.text,
      htmlBody: message.html,
      attachments: message.attachments ?? null,
      nextAttemptAt: new Date(),
    },
    { transaction: options.transaction },
  );
  return row.id;
}
