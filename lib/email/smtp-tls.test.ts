import { describe, expect, it } from 'vitest';
import { smtpTlsOptions } from './smtp-tls';

const base = { SMTP_HOST: 'smtp.example.org', SMTP_PORT: 587, SMTP_SECURE: false, SMTP_REQUIRE_TLS: true };

describe('smtpTlsOptions', () => {
  it('requires STARTTLS on a relay that is not on loopback', () => {
    expect(smtpTlsOptions(base)).toEqual({ secure: false, requireTLS: true, ignoreTLS: false });
  });
  it('lets SMTP_REQUIRE_TLS=false send without STARTTLS (still used when offered)', () => {
    expect(smtpTlsOptions({ ...base, SMTP_REQUIRE_TLS: false })).toEqual({ secure: false, requireTLS: false, ignoreTLS: false });
  });
  it('keeps the loopback relay (the local fake) in the clear', () => {
    for (const host of ['127.0.0.1', 'localhost', '::1', '127.0.0.2'])
      expect(smtpTlsOptions({ ...base, SMTP_HOST: host, SMTP_PORT: 2525 })).toMatchObject({ requireTLS: false, ignoreTLS: true });
  });
  it('uses implicit TLS on port 465 or with SMTP_SECURE=true', () => {
    expect(smtpTlsOptions({ ...base, SMTP_PORT: 465 })).toEqual({ secure: true, requireTLS: false, ignoreTLS: false });
    expect(smtpTlsOptions({ ...base, SMTP_SECURE: true, SMTP_PORT: 2465 })).toMatchObject({ secure: true });
  });
});
