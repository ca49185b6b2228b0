import { describe, expect, it } from 'vitest';
import { applyClientAddress, socketAddress } from './client-address';

describe('the client address the app sees', () => {
  it('without a trusted proxy a client cannot choose it: X-Forwarded-For becomes the connection’s address', () => {
    const headers: Record<string, string> = { 'x-forwarded-for': '198.51.100.7, 10.0.0.1', 'x-real-ip': '198.51.100.8', accept: 'text/html' };
    applyClientAddress(headers, '::ffff:203.0.113.5', false);
    expect(headers).toEqual({ 'x-forwarded-for': '203.0.113.5', accept: 'text/html' });
  });

  it('a request with no header gets one too', () => {
    const headers: Record<string, string> = {};
    applyClientAddress(headers, '2001:db8::1', false);
    expect(headers['x-forwarded-for']).toBe('2001:db8::1');
  });

  it('behind a trusted proxy (TRUST_PROXY=true) the proxy’s header is kept as it came', () => {
    const headers: Record<string, string> = { 'x-forwarded-for': '198.51.100.7', 'x-real-ip': '198.51.100.7' };
    applyClientAddress(headers, '127.0.0.1', true);
    expect(headers).toEqual({ 'x-forwarded-for': '198.51.100.7', 'x-real-ip': '198.51.100.7' });
  });

  it('writes addresses as people do: IPv4 without the ::ffff: of a dual-stack socket, IPv6 as is', () => {
    expect(socketAddress('::ffff:127.0.0.1')).toBe('127.0.0.1');
    expect(socketAddress('::1')).toBe('::1');
    expect(socketAddress('::ffff:abcd')).toBe('::ffff:abcd');
    expect(socketAddress(undefined)).toBe('unknown');
  });
});
