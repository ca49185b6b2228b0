import { describe, expect, it } from 'vitest';
import { isCrossSite } from './same-origin';

const APP = () => ['https://preserve.example.org'];
const req = (method: string, headers: Record<string, string>, url = 'http://127.0.0.1:3000/api/enrollments') => new Request(url, { method, headers });

describe('isCrossSite', () => {
  it('lets through reads, and writes with neither header (scripts, tests, the payment service)', () => {
    expect(isCrossSite(req('GET', { origin: 'https://evil.example', 'sec-fetch-site': 'cross-site' }), APP)).toBe(false);
    expect(isCrossSite(req('POST', {}), APP)).toBe(false);
  });

  it('trusts Sec-Fetch-Site when the browser sends it: only same-origin (or none) may write', () => {
    expect(isCrossSite(req('POST', { 'sec-fetch-site': 'same-origin' }), APP)).toBe(false);
    expect(isCrossSite(req('POST', { 'sec-fetch-site': 'none' }), APP)).toBe(false);
    expect(isCrossSite(req('POST', { 'sec-fetch-site': 'cross-site' }), APP)).toBe(true);
    // A sibling subdomain is another origin: it does not write either.
    expect(isCrossSite(req('DELETE', { 'sec-fetch-site': 'same-site' }), APP)).toBe(true);
    expect(isCrossSite(req('PATCH', { 'sec-fetch-site': 'cross-site', origin: 'http://127.0.0.1:3000' }), APP)).toBe(true);
  });

  it('else compares Origin with the request’s own origin and the app’s configured origins', () => {
    expect(isCrossSite(req('POST', { origin: 'http://127.0.0.1:3000' }), APP)).toBe(false);
    expect(isCrossSite(req('POST', { origin: 'https://preserve.example.org' }), APP)).toBe(false);
    expect(isCrossSite(req('POST', { origin: 'https://evil.example' }), APP)).toBe(true);
    expect(isCrossSite(req('PUT', { origin: 'http://127.0.0.1:3001' }), APP)).toBe(true);
    expect(isCrossSite(req('POST', { origin: 'null' }), APP)).toBe(true);
  });
});
