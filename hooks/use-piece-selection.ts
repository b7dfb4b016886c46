/**
 * The piece the person has picked, shared between the 3D studio view and the flat pieces board so that picking
 * a piece in one highlights it in the other.
 */
import { createContext, createElement, useContext, useMemo, useState, type ReactNode } from 'react';

/** The shared selection: a piece label from the pattern (e.g. "A"), or `null` when nothing is picked. */
export interface PieceSelection {
  selectedLabel: string | null;
  /** Picks the piece `label`, or clears the pick with `null`. */
  select(label: string | null): void;
}

const PieceSelectionContext = createContext<PieceSelection | null>(null);

/** Holds one piece selection for its children (the studio screen wraps its 3D and 2D views in it). */
export function PieceSelectionProvider({ initialLabel = null, children }: { initialLabel?: string | null; children: ReactNode }) {
  const [selectedLabel, setSelectedLabel] = useState<string | null>(initialLabel);
  const value = useMemo<PieceSelection>(() => ({ selectedLabel, select: setSelectedLabel }), [selectedLabel]);
  return createElement(PieceSelectionContext.Provider, { value }, children);
}

/**
 * The shared piece selection. Outside a PieceSelectionProvider it is a selection that never holds anything, so a
 * pieces board drawn on its own page still renders (its clicks then have no effect beyond its own props).
 */
export function usePieceSelection(): PieceSelection {
  return useContext(PieceSelectionContext) ?? detachedSelection;
}

const detachedSelection: PieceSelection = { selectedLabel: null, select: () => undefined };
