import { describe, expect, it } from 'vitest';
import { formatWhen } from '../../../components/builds/format-time';

// Expected strings follow the Unicode CLDR patterns (from memory, checked against Node's bundled ICU): en-GB
// medium date "d MMM y", short time "HH:mm", joined as "{date}, {time}"; en-US medium "MMM d, y", short
// "h:mm a".

describe('formatWhen', () => {
  it('formats a UTC instant in British English', () => {
    expect(formatWhen('2026-03-04T14:05:00Z', 'en-GB', 'UTC')).toBe('4 Mar 2026, 14:05');
  });

  it('shifts to the reader\'s zone (Europe/Berlin is UTC+1 in March before DST)', () => {
    expect(formatWhen('2026-03-04T14:05:00Z', 'en-GB', 'Europe/Berlin')).toBe('4 Mar 2026, 15:05');
  });

  it('uses the US pattern for en-US', () => {
    expect(formatWhen('2026-03-04T14:05:00Z', 'en-US', 'UTC').replace(/\u202f/g, ' ')).toBe('Mar 4, 2026, 2:05 PM');
  });

  it('says so when the time does not parse', () => {
    expect(formatWhen('yesterday-ish', 'en-GB', 'UTC')).toBe('unknown time');
  });
});
