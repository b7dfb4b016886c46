import { afterEach, describe, expect, it, vi } from 'vitest';
import type { Membership } from '../../hooks/api-types';
import { pickMembership, readShopChoice, shopChoiceStorageKey, writeShopChoice } from '../../hooks/shop-choice';

// Behaviour from the H2 brief: a person may belong to several shops; the choice is remembered in localStorage
// on web (Web Storage, WHATWG HTML §12: getItem returns null for a missing key; setItem may throw
// QuotaExceededError, and access may throw SecurityError when storage is blocked).

const ms: Membership[] = [
  { shopId: '4', shopName: 'Tinder Lane Costume Works', role: 'viewer' },
  { shopId: '9', shopName: 'Kiln Hollow Props', role: 'owner' },
  { shopId: '12', shopName: 'Night Bench Crew', role: 'editor' },
];

afterEach(() => vi.unstubAllGlobals());

describe('pickMembership', () => {
  it('keeps a remembered shop the person still belongs to', () => {
    expect(pickMembership(ms, '12')?.shopName).toBe('Night Bench Crew');
  });
  it('falls back to the first owned shop when the remembered one is gone', () => {
    expect(pickMembership(ms, '77')?.shopId).toBe('9');
    expect(pickMembership(ms, null)?.shopId).toBe('9');
  });
  it('falls back to the first membership when the person owns none', () => {
    expect(pickMembership([ms[0], ms[2]], null)?.shopId).toBe('4');
  });
  it('returns null for a person in no shop', () => {
    expect(pickMembership([], '9')).toBeNull();
  });
});

describe('shop choice storage', () => {
  it('round-trips through localStorage under its key', () => {
    const store = new Map<string, string>();
    vi.stubGlobal('localStorage', {
      getItem: (k: string) => store.get(k) ?? null,
      setItem: (k: string, v: string) => void store.set(k, v),
    });
    expect(readShopChoice()).toBeNull();
    writeShopChoice('12');
    expect(store.get(shopChoiceStorageKey)).toBe('12');
    expect(readShopChoice()).toBe('12');
  });

  it('survives storage that throws (blocked or full)', () => {
    vi.stubGlobal('localStorage', {
      getItem: () => {
        throw new DOMException('blocked', 'SecurityError');
      },
      setItem: () => {
        throw new DOMException('full', 'QuotaExceededError');
      },
    });
    expect(readShopChoice()).toBeNull();
    expect(() => writeShopChoice('9')).not.toThrow();
  });

  it('returns null where there is no web storage at all (native, server)', () => {
    expect(typeof localStorage).toBe('undefined');
    expect(readShopChoice()).toBeNull();
  });
});
