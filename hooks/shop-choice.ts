/**
 * Which of a person's shops is chosen, and where that choice is remembered between visits.
 */
import type { Membership } from './api-types';

/** localStorage key for the last chosen shop id. */
export const shopChoiceStorageKey = 'sheetsmith.shopId';

/**
 * Returns the membership to show: the one whose shop id is `wanted` if the person belongs to it, otherwise the
 * first shop they own, otherwise their first membership, or `null` when they belong to no shop.
 */
export function pickMembership(memberships: readonly Membership[], wanted: string | null): Membership | null {
  if (wanted !== null) {
    const hit = memberships.find((m) => m.shopId === wanted);
    if (hit) return hit;
  }
  return memberships.find((m) => m.role === 'owner') ?? memberships[0] ?? null;
}

/** Reads the remembered shop id; `null` where there is no web storage (native, private modes that throw). */
export function readShopChoice(): string | null {
  try {
    return typeof localStorage === 'undefined' ? null : localStorage.getItem(shopChoiceStorageKey);
  } catch {
    return null;
  }
}

/** Remembers `shopId` as the chosen shop; silently does nothing where web storage is unavailable. */
export function writeShopChoice(shopId: string): void {
  try {
    if (typeof localStorage !== 'undefined') localStorage.setItem(shopChoiceStorageKey, shopId);
  } catch {
    // Storage full or blocked: the choice then lasts only for this visit, which is acceptable.
  }
}
