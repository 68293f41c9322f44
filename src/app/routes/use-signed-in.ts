import { useOutletContext } from 'react-router-dom';
import type { Me } from '../../../shared/schemas/members';

/** The signed-in, admitted person, as the app shell handed it to its pages. */
export function useSignedIn(): Me {
  return useOutletContext<Me>();
}
