import { useMutation, useQueryClient } from '@tanstack/react-query';
import { meKeys } from './keys';

export async function signOut() {
  // Loaded on demand: the auth client is only needed on the way in and out, not on every page.
  const { authClient, unwrapAuth } = await import('../../../lib/auth-client');
  return unwrapAuth(await authClient.signOut());
}

export function useSignOut() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signOut,
    onSuccess: () => {
      // Nothing of this person's data may linger for whoever signs in next on this device.
      queryClient.removeQueries({ predicate: (query) => query.queryKey[0] !== meKeys.all[0] });
      queryClient.setQueryData(meKeys.all, null);
      return queryClient.invalidateQueries({ queryKey: meKeys.all });
    },
  });
}
