import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { Link } from 'react-router-dom';
import { PASSWORD_MIN } from '../../../../shared/schemas/common';
import { resetPasswordSchema } from '../../../../shared/schemas/members';
import { paths } from '../../../app/paths';
import { errorMessage } from '../../../lib/api-client';
import { Alert } from '../../../components/ui/alert';
import { Button, ButtonLink } from '../../../components/ui/button';
import { Field, TextInput } from '../../../components/ui/field';
import { useResetPassword } from '../api/reset-password';

/** `token` comes from the e-mailed link; null when the link was broken or has expired. */
export function ResetPasswordForm({ token }: { token: string | null }) {
  const reset = useResetPassword();
  const form = useForm({
    resolver: zodResolver(resetPasswordSchema),
    defaultValues: { password: '', confirm: '' },
  });
  const { errors } = form.formState;

  if (!token) {
    return (
      <div className="flex flex-col gap-5">
        <Alert tone="warning" title="This link no longer works">
          Password links work once and expire after a while. Ask for a new one and use the latest e-mail.
        </Alert>
        <ButtonLink to={paths.forgotPassword()}>Ask for a new link</ButtonLink>
      </div>
    );
  }

  if (reset.isSuccess) {
    return (
      <div className="flex flex-col gap-5">
        <Alert tone="success" title="Password changed">
          Your new password is set. Sign in with it now.
        </Alert>
        <ButtonLink to={paths.signIn()}>Sign in</ButtonLink>
      </div>
    );
  }

  const onSubmit = form.handleSubmit(async (values) => {
    await reset.mutateAsync({ token, newPassword: values.password }).catch(() => undefined);
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-5">
      {reset.isError ? (
        <Alert tone="danger">
          {errorMessage(reset.error)} <Link to={paths.forgotPassword()}>Ask for a new link</Link> if this one has expired.
        </Alert>
      ) : null}
      <Field label="New password" hint={`At least ${PASSWORD_MIN} characters.`} error={errors.password?.message}>
        <TextInput type="password" autoComplete="new-password" {...form.register('password')} />
      </Field>
      <Field label="New password again" error={errors.confirm?.message}>
        <TextInput type="password" autoComplete="new-password" {...form.register('confirm')} />
      </Field>
      <Button type="submit" busy={reset.isPending}>
        Set new password
      </Button>
    </form>
  );
}
