import { isLoopback } from '@/lib/production-check';

export type SmtpTlsSettings = { SMTP_HOST: string; SMTP_PORT: number; SMTP_SECURE: boolean; SMTP_REQUIRE_TLS: boolean };

/**
 * How the SMTP connection is protected: implicit TLS with SMTP_SECURE=true or on port 465;
 * otherwise STARTTLS is required (nodemailer refuses to send in the clear) unless the relay is on
 * loopback (the demo's fake, a local relay) or SMTP_REQUIRE_TLS=false, where it is still used when
 * the relay offers it, but not on loopback, whose fake has no certificate.
 */
export function smtpTlsOptions(env: SmtpTlsSettings): { secure: boolean; requireTLS: boolean; ignoreTLS: boolean } {
  if (env.SMTP_SECURE || env.SMTP_PORT === 465) return { secure: true, requireTLS: false, ignoreTLS: false };
  if (isLoopback(env.SMTP_HOST)) return { secure: false, requireTLS: false, ignoreTLS: true };
  return { secure: false, requireTLS: env.SMTP_REQUIRE_TLS, ignoreTLS: false };
}
