import { createContext, useContext } from 'react';
import type { RoundBundle, RoundLine, RoundView } from '../../../../shared/schemas/allocation';

export type RoundContextValue = {
  round: RoundView;
  /** Only a proposed round that is not being solved takes hand edits. */
  editable: boolean;
  /** Bundles the server named when it refused approval (plants now on hold). */
  heldIds: ReadonlySet<string>;
  askRemove: (bundle: RoundBundle) => void;
  askAdd: (line: RoundLine) => void;
};

// The bundle table's columns live at module scope (as the table expects), so the cells read
// the round and the page's actions from here rather than from props.
export const RoundContext = createContext<RoundContextValue | null>(null);

export function useRoundContext(): RoundContextValue {
  const value = useContext(RoundContext);
  if (!value) throw new Error('RoundContext is missing');
  return value;
}
