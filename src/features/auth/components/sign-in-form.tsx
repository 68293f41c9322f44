import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { Link } from 'react-router-dom';
import { signInSchema } from '../../../../shared/schemas/members';
import { paths } from '../../../app/paths';
import { errorMessage } from '../../../lib/api-client';
import { applyServerFieldErrors } from '../../../lib/form-errors';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Field, TextInput } from '../../../components/ui/field';
import { useSignIn } from '../api/sign-in';

export function SignInForm({ onSignedIn }: { onSignedIn: () => void }) {
  const signIn = useSignIn();
  const form = useForm({
    resolver: zodResolver(signInSchema),
    defaultValues: { email: '', password: '' },
  });
  const { errors } = form.formState;

  const onSubmit = form.handleSubmit(async (values) => {
    try {
      await signIn.mutateAsync(values);
      onSignedIn();
    } catch (error) {
      applyServerFieldErrors(error, form.setError, ['email', 'password']);
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-5">
      {signIn.isError ? <Alert tone="danger">{errorMessage(signIn.error)}</Alert> : null}
      <Field label="E-mail" error={errors.email?.message}>
        <TextInput type="email" autoComplete="email" inputMode="email" {...form.register('email')} />
      </Field>
      <Field label="Password" error={errors.password?.message}>
        <TextInput type="password" autoComplete="current-password" {...form.register('password')} />
      </Field>
      <Button type="submit" busy={signIn.isPending}>
        Sign in
      </Button>
      <div className="flex flex-col gap-2 text-ink-soft sm:flex-row sm:justify-between">
        <Link to={paths.forgotPassword()}>Forgot your password?</Link>
        <p>
          New to the cooperative? <Link to={paths.signUp()}>Apply to join</Link>
        </p>
      </div>
    </form>
  );
}
