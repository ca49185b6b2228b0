import { describe, expect, it } from 'vitest';
import { actionWords, knownActions, subjectWords } from './words';

describe('audit words', () => {
  it('says each known action in plain words, and spells out one it does not know', () => {
    expect(actionWords('user.roles_changed')).toBe('changed the roles of an account');
    expect(actionWords('practical.changes_requested')).toBe('asked for changes to a practical');
    expect(actionWords('gauge.day_scheduled')).toBe('gauge: day scheduled');
    expect(knownActions()).toContain('user.deactivated');
  });
  it('names the record', () => {
    expect(subjectWords('enrollment', '42')).toBe('Enrollment 42');
    expect(subjectWords('fee_waiver', '3')).toBe('Fee waiver 3');
    expect(subjectWords('program', '1')).toBe('Program settings');
    expect(subjectWords('service_entry', '9')).toBe('service entry 9');
  });
});
