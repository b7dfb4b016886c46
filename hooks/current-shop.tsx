/**
 * The shop the signed-in person is working in, shared by the navigation and every shop page.
 */
import { createContext, useCallback, useContext, useMemo, useState, type ReactNode } from 'react';
import type { Membership } from './api-types';
import { pickMembership, readShopChoice, writeShopChoice } from './shop-choice';

interface CurrentShop {
  /** The chosen membership (shop id, name, role), or `null` when the person belongs to no shop. */
  membership: Membership | null;
  memberships: readonly Membership[];
  /** Chooses the shop `shopId` and remembers it; an id the person is not a member of falls back as in pickMembership. */
  choose: (shopId: string) => void;
}

const CurrentShopContext = createContext<CurrentShop | null>(null);

/** Provides the current shop to its children, chosen among `memberships` and remembered in localStorage on web. */
export function CurrentShopProvider({ memberships, children }: { memberships: readonly Membership[]; children: ReactNode }) {
  const [wanted, setWanted] = useState<string | null>(readShopChoice);
  const membership = pickMembership(memberships, wanted);
  // A just-created shop is chosen before the refetched memberships list it, so the id is not checked here.
  const choose = useCallback((shopId: string) => {
    writeShopChoice(shopId);
    setWanted(shopId);
  }, []);
  const value = useMemo(() => ({ membership, memberships, choose }), [membership, memberships, choose]);
  return <CurrentShopContext.Provider value={value}>{children}</CurrentShopContext.Provider>;
}

/** The current shop; must be called under CurrentShopProvider (the signed-in layout installs it). */
export function useCurrentShop(): CurrentShop {
  const value = useContext(CurrentShopContext);
  if (!value) throw new Error('useCurrentShop is used outside the signed-in area (no CurrentShopProvider above it).');
  return value;
}
