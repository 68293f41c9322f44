import { useMutation, useQueryClient } from '@tanstack/react-query';
import { authClient, unwrapAuth } from '../../../lib/auth-client';
import { meKeys } from './keys';

export type SignUpValues = { name: string; email: string; password: string; placeName: string; application: string };

/** An application to join: the account stays "pending" until a coordinator admits it. */
export async function signUp(values: SignUpValues) {
  return unwrapAuth(
    await authClient.signUp.email({
      name: values.name,
      email: values.email,
      password: values.password,
      placeName: values.placeName,
      application: values.application,
    }),
  );
}

export function useSignUp() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: signUp,
    // The server may sign the applicant in straight away; the shell then shows the pending page.
    onSuccess: () => queryClient.invalidateQueries({ queryKey: meKeys.all, refetchType: 'all' }),
  });
}
