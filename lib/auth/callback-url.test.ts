import { describe, expect, it } from 'vitest';
import { callbackPath } from './callback-url';

const ORIGIN = 'http://localhost:3000';

describe('callbackPath', () => {
  it('keeps a path on the site with its query and fragment', () => {
    expect(callbackPath('/learn/pickling-and-canning/processing?x=1#top', ORIGIN)).toBe('/learn/pickling-and-canning/processing?x=1#top');
    expect(callbackPath('http://localhost:3000/desk', ORIGIN)).toBe('/desk');
  });

  // WHATWG URL parsing, as browsers do it: a backslash is a slash in http(s) URLs, tab and newline are removed.
  it.each([
    ['/\\evil.example/x'],
    ['/%5Cevil.example/x'.replace('%5C', '\\')],
    ['/\t/evil.example'],
    ['/\n/evil.example/x'],
    ['//evil.example/x'],
    ['\\\\evil.example'],
    ['http://evil.example/x'],
    ['https://localhost:3000/x'],
    ['javascript:alert(1)'],
    ['http://[::1'],
  ])('sends %j home, never off the site', (value) => {
    expect(callbackPath(value, ORIGIN)).toBe('/');
  });

  it('never answers a protocol-relative path', () => {
    expect(callbackPath('/.//evil.example', ORIGIN)).toBe('/evil.example');
    expect(callbackPath('http://localhost:3000//evil.example/x', ORIGIN)).toBe('/evil.example/x');
  });

  it('goes home without a value', () => {
    expect(callbackPath(undefined, ORIGIN)).toBe('/');
    expect(callbackPath('', ORIGIN)).toBe('/');
  });
});
