import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { Link } from 'react-router-dom';
import { PASSWORD_MIN } from '../../../../shared/schemas/common';
import { signUpSchema } from '../../../../shared/schemas/members';
import { paths } from '../../../app/paths';
import { errorMessage } from '../../../lib/api-client';
import { applyServerFieldErrors } from '../../../lib/form-errors';
import { Alert } from '../../../components/ui/alert';
import { Button } from '../../../components/ui/button';
import { Field, TextArea, TextInput } from '../../../components/ui/field';
import { useSignUp } from '../api/sign-up';

const FIELDS = ['name', 'email', 'password', 'placeName', 'application'] as const;

export function SignUpForm({ onApplied }: { onApplied: () => void }) {
  const signUp = useSignUp();
  const form = useForm({
    resolver: zodResolver(signUpSchema),
    defaultValues: { name: '', email: '', password: '', placeName: '', application: '' },
  });
  const { errors } = form.formState;

  const onSubmit = form.handleSubmit(async (values) => {
    try {
      await signUp.mutateAsync(values);
      onApplied();
    } catch (error) {
      applyServerFieldErrors(error, form.setError, FIELDS);
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-5">
      {signUp.isError ? <Alert tone="danger">{errorMessage(signUp.error)}</Alert> : null}
      <Field label="Name" error={errors.name?.message}>
        <TextInput autoComplete="name" {...form.register('name')} />
      </Field>
      <Field label="E-mail" error={errors.email?.message}>
        <TextInput type="email" autoComplete="email" inputMode="email" {...form.register('email')} />
      </Field>
      <Field label="Password" hint={`At least ${PASSWORD_MIN} characters.`} error={errors.password?.message}>
        <TextInput type="password" autoComplete="new-password" {...form.register('password')} />
      </Field>
      <Field
        label="Where you grow"
        optional
        hint="Village, town or farm. It helps the cooperative find wood close to you."
        error={errors.placeName?.message}
      >
        <TextInput autoComplete="address-level2" {...form.register('placeName')} />
      </Field>
      <Field
        label="What you plan to grow"
        optional
        hint="A hedgerow, a nursery bed, shrubs between orchard trees: a few lines for the coordinator."
        error={errors.application?.message}
      >
        <TextArea rows={5} {...form.register('application')} />
      </Field>
      <Button type="submit" busy={signUp.isPending}>
        Apply to join
      </Button>
      <p className="text-ink-soft">
        Already a member? <Link to={paths.signIn()}>Sign in</Link>
      </p>
    </form>
  );
}
