import { createContext, useContext } from 'react';
import type { FarmSummary } from '../../../../shared/schemas/farms';

/**
 * What row cells need beyond the row itself. Table cells are defined once at module scope,
 * so the route's data reaches them through context rather than through new column objects.
 */
export type MembersTableContextValue = {
  currentUserId: string;
  farms: FarmSummary[];
  farmsUnavailable: string | null;
  /** Lets the route refresh what else depends on farm membership (farm counts, "me"). */
  onMembershipChange?: () => void;
};

export const MembersTableContext = createContext<MembersTableContextValue | null>(null);

export function useMembersTableContext(): MembersTableContextValue {
  const value = useContext(MembersTableContext);
  if (!value) throw new Error('Member table cells must be inside MembersTableContext');
  return value;
}

/**
 * Id of the cell holding a member's name. Row buttons keep their plain names ("Admit") and
 * point here with aria-describedby, so a screen reader also hears whose row it is.
 */
export function memberNameId(memberId: string): string {
  return `member-name-${memberId}`;
}
