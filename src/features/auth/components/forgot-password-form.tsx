import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { Link } from 'react-router-dom';
import { forgotPasswordSchema } from '../../../../shared/schemas/members';
import { paths } from '../../../app/paths';
import { errorMessage } from '../../../lib/api-client';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Field, TextInput } from '../../../components/ui/field';
import { useRequestPasswordReset } from '../api/request-password-reset';

export function ForgotPasswordForm() {
  const request = useRequestPasswordReset();
  const form = useForm({
    resolver: zodResolver(forgotPasswordSchema),
    defaultValues: { email: '' },
  });
  const { errors } = form.formState;

  const onSubmit = form.handleSubmit(async (values) => {
    await request.mutateAsync(values.email).catch(() => undefined);
  });

  if (request.isSuccess) {
    // Same words whether or not the address is known, so the form cannot be used to
    // find out who is a member.
    return (
      <div className="flex flex-col gap-5">
        <Alert tone="success" title="Check your e-mail">
          If that address is registered, a link is on its way. It works once and for a limited time.
        </Alert>
        <p>
          <Link to={paths.signIn()}>Back to sign in</Link>
        </p>
      </div>
    );
  }

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-5">
      <p className="text-ink-soft">Give the e-mail address you joined with and Heelwood will send a link to set a new password.</p>
      {request.isError ? <Alert tone="danger">{errorMessage(request.error)}</Alert> : null}
      <Field label="E-mail" error={errors.email?.message}>
        <TextInput type="email" autoComplete="email" inputMode="email" {...form.register('email')} />
      </Field>
      <Button type="submit" busy={request.isPending}>
        Send the link
      </Button>
      <p>
        <Link to={paths.signIn()}>Back to sign in</Link>
      </p>
    </form>
  );
}
