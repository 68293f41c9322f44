import { useMutation, useQueryClient } from '@tanstack/react-query';
import { resetUnauthorizedRedirect } from '../../../lib/api-client';
import { authClient, unwrapAuth } from '../../../lib/auth-client';
import { meKeys } from './keys';

export type SignInValues = { email: string; password: string };

export async function signIn(values: SignInValues) {
  // A suspended member is refused here with a 403 and the server's own explanation.
  return unwrapAuth(await authClient.signIn.email({ email: values.email, password: values.password }));
}

export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signIn,
    onSuccess: () => {
      resetUnauthorizedRedirect();
      // 'all' so that a cached "nobody" is replaced before the shell looks at it.
      return queryClient.invalidateQueries({ queryKey: meKeys.all, refetchType: 'all' });
    },
  });
}
