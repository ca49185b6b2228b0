import 'server-only';
import crypto from 'node:crypto';
import os from 'node:os';
import nodemailer, { type Transporter } from 'nodemailer';
import { Op, QueryTypes, Transaction } from 'sequelize';
import { getEnv } from '@/lib/env';
import { db, type OutboxEmail } from '@/models';
import type { OutgoingAttachment } from './outbox';
import { smtpTlsOptions } from './smtp-tls';

export type SenderOptions = {
  /** Rows claimed per round. */
  batchSize?: number;
  /** First retry delay; doubled after each failed attempt, up to maxBackoffMs. */
  backoffBaseMs?: number;
  maxBackoffMs?: number;
  /** After this many failed attempts a row is marked failed and left for a person to look at. */
  maxAttempts?: number;
  /** A row left 'sending' longer than this (a sender that died mid-way) is claimed again. */
  staleClaimMs?: number;
  transport?: Transporter;
  now?: () => Date;
};

export type RoundResult = { claimed: number; sent: number; failed: number; retrying: number };

/** Delay before the next attempt after `attempts` failed ones: base · 2^(attempts−1), capped. */
export function backoffMs(attempts: number, baseMs = 5_000, maxMs = 15 * 60_000): number {
  return Math.min(maxMs, baseMs * 2 ** Math.max(0, attempts - 1));
}

let transportCache: { key: string; transport: Transporter } | undefined;

/** The SMTP transport from configuration (the local fake in the demo and the tests). */
export function smtpTransport(): Transporter {
  const env = getEnv();
  const key = `${env.SMTP_HOST}:${env.SMTP_PORT}:${env.SMTP_SECURE}:${env.SMTP_REQUIRE_TLS}:${env.SMTP_USER ?? ''}`;
  if (transportCache?.key !== key) {
    transportCache = {
      key,
      transport: nodemailer.createTransport({
        host: env.SMTP_HOST,
        port: env.SMTP_PORT,
        ...smtpTlsOptions(env),
        auth: env.SMTP_USER ? { user: env.SMTP_USER, pass: env.SMTP_PASSWORD ?? '' } : undefined,
        connectionTimeout: 5_000,
        greetingTimeout: 5_000,
        socketTimeout: 10_000,
      }),
    };
  }
  return transportCache.transport;
}

const DUE = `((status = 'pending' AND nextAttemptAt <= :now) OR (status = 'sending' AND claimedAt < :stale))`;

/**
 * Locks up to `limit` due rows that no other transaction holds, and answers their ids. A plain read
 * picks candidates first; the locking read then walks the primary key over them (FORCE INDEX, so
 * there is no sort) with SKIP LOCKED and stops at `limit`, so it locks only the rows it returns. (A
 * locking read through the status index with a sort — the optimizer's choice for this WHERE — locks
 * every due row it scans and leaves a second sender nothing.) The due condition is checked again
 * under the lock, on the latest committed version of each row.
 */
export async function lockDueIds(transaction: Transaction, options: { limit: number; now: Date; staleClaimMs: number }): Promise<number[]> {
  const { sequelize } = db();
  const replacements = { now: options.now, stale: new Date(options.now.getTime() - options.staleClaimMs), limit: options.limit, candidates: options.limit * 4 };
  // Raw SQL: a plain read of candidate ids, shared with the locking read below.
  const candidates = await sequelize.query<{ id: number }>(`SELECT id FROM outbox_emails WHERE ${DUE} ORDER BY id LIMIT :candidates`, {
    replacements,
    type: QueryTypes.SELECT,
    transaction,
  });
  if (!candidates.length) return [];
  // Raw SQL: FORCE INDEX and SKIP LOCKED (see the comment above lockDueIds); Sequelize emits neither.
  const locked = await sequelize.query<{ id: number }>(
    `SELECT id FROM outbox_emails FORCE INDEX (PRIMARY) WHERE id IN (:ids) AND ${DUE} ORDER BY id LIMIT :limit FOR UPDATE SKIP LOCKED`,
    {
      replacements: { ...replacements, ids: candidates.map((r) => r.id) },
      type: QueryTypes.SELECT,
      transaction,
    },
  );
  return locked.map((r) => r.id);
}

/**
 * Claims due rows for this sender in one short READ COMMITTED transaction (no gap locks, so the
 * app's inserts never wait for it): lockDueIds, then an UPDATE marks the rows with this sender's
 * token. Two senders running at once never take the same row, and neither waits for the other.
 */
export async function claimDue(token: string, options: Required<Pick<SenderOptions, 'batchSize' | 'staleClaimMs'>> & { now: Date }): Promise<OutboxEmail[]> {
  const { OutboxEmail, sequelize } = db();
  return sequelize.transaction({ isolationLevel: Transaction.ISOLATION_LEVELS.READ_COMMITTED }, async (transaction) => {
    const ids = await lockDueIds(transaction, { limit: options.batchSize, now: options.now, staleClaimMs: options.staleClaimMs });
    if (!ids.length) return [];
    // Raw SQL: one UPDATE claims every locked row with the token and bumps attempts in place.
    await sequelize.query(
      `UPDATE outbox_emails SET status = 'sending', claimedBy = :token, claimedAt = :now, attempts = attempts + 1, updatedAt = :now WHERE id IN (:ids)`,
      {
        replacements: { token, now: options.now, ids },
        type: QueryTypes.UPDATE,
        transaction,
      },
    );
    return OutboxEmail.findAll({ where: { id: { [Op.in]: ids } }, order: [['id', 'ASC']], transaction });
  });
}

/**
 * The Message-ID of an outbox row: the same on every attempt, so a message delivered twice (see
 * sendDueEmails) is recognisable as one by the receiving side and by the tests.
 */
export function messageIdFor(row: Pick<OutboxEmail, 'id' | 'createdAt'>): string {
  return `<outbox-${row.id}-${row.createdAt.getTime()}@brinewright.local>`;
}

function attachmentsOf(row: OutboxEmail) {
  const list = (row.attachments ?? []) as unknown as OutgoingAttachment[];
  return list.map((a) => ({ filename: a.filename, contentType: a.contentType, content: Buffer.from(a.contentBase64, 'base64') }));
}

/**
 * One round: claim due rows, send each, mark it sent (or schedule the retry).
 *
 * Delivery is at-least-once, not exactly-once: a row is marked sent only after the SMTP server has
 * accepted it. If this process dies (or the database goes away) between the two, the row stays
 * claimed; once its claim is older than `staleClaimMs` another round sends it again, with the same
 * Message-ID. Nothing is ever lost, and a duplicate is possible only in that window.
 */
export async function sendDueEmails(options: SenderOptions = {}): Promise<RoundResult> {
  const now = options.now?.() ?? new Date();
  const token = `${os.hostname()}:${process.pid}:${crypto.randomBytes(6).toString('hex')}`;
  const rows = await claimDue(token, { batchSize: options.batchSize ?? 20, staleClaimMs: options.staleClaimMs ?? 5 * 60_000, now });
  const result: RoundResult = { claimed: rows.length, sent: 0, failed: 0, retrying: 0 };
  if (!rows.length) return result;
  const transport = options.transport ?? smtpTransport();
  const from = getEnv().MAIL_FROM;
  const { OutboxEmail } = db();
  for (const row of rows) {
    let smtpError: unknown = null;
    try {
      await transport.sendMail({
        from,
        to: row.toAddress,
        subject: row.subject,
        text: row.textBody,
        html: row.htmlBody,
        attachments: attachmentsOf(row),
        headers: { 'X-Brinewright-Kind': row.kind, 'X-Brinewright-Outbox-Id': String(row.id) },
        messageId: messageIdFor(row),
      });
    } catch (error) {
      smtpError = error;
    }
    if (smtpError === null) {
      // Accepted by SMTP. A database failure here propagates: the row stays claimed and is sent
      // again after staleClaimMs (the at-least-once window), never marked for a quick retry.
      await OutboxEmail.update({ status: 'sent', sentAt: new Date(), lastError: null, claimedBy: null }, { where: { id: row.id, claimedBy: token } });
      result.sent += 1;
      continue;
    }
    const message = (smtpError instanceof Error ? smtpError.message : String(smtpError)).slice(0, 1000);
    const giveUp = row.attempts >= (options.maxAttempts ?? 20);
    await OutboxEmail.update(
      {
        status: giveUp ? 'failed' : 'pending',
        lastError: message,
        claimedBy: null,
        nextAttemptAt: new Date(now.getTime() + backoffMs(row.attempts, options.backoffBaseMs, options.maxBackoffMs)),
      },
      { where: { id: row.id, claimedBy: token } },
    );
    if (giveUp) result.failed += 1;
    else result.retrying += 1;
  }
  return result;
}

/** Rows still to go (pending or being sent), for the worker's log and the tests. */
export async function outboxBacklog(): Promise<number> {
  return db().OutboxEmail.count({ where: { status: { [Op.in]: ['pending', 'sending'] } } });
}
