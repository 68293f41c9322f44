// @vitest-environment jsdom
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { cleanup, render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { MemoryRouter } from 'react-router-dom';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { SignInForm } from '../components/sign-in-form';

afterEach(cleanup);

function renderForm(onSignedIn = vi.fn()) {
  const client = new QueryClient({ defaultOptions: { queries: { retry: false }, mutations: { retry: false } } });
  render(
    <QueryClientProvider client={client}>
      <MemoryRouter>
        <SignInForm onSignedIn={onSignedIn} />
      </MemoryRouter>
    </QueryClientProvider>,
  );
  return { onSignedIn };
}

describe('SignInForm', () => {
  it('has the labelled fields and the Sign in button', () => {
    renderForm();
    expect(screen.getByLabelText('E-mail')).toBeTruthy();
    expect(screen.getByLabelText('Password')).toBeTruthy();
    expect(screen.getByRole('button', { name: 'Sign in' })).toBeTruthy();
  });

  it('names each missing field when submitted empty, and ties the message to its input', async () => {
    const user = userEvent.setup();
    const { onSignedIn } = renderForm();

    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    expect(await screen.findByText('E-mail is required')).toBeTruthy();
    expect(screen.getByText('Password is required')).toBeTruthy();
    const email = screen.getByLabelText('E-mail');
    expect(email.getAttribute('aria-invalid')).toBe('true');
    const describedBy = email.getAttribute('aria-describedby') ?? '';
    expect(document.getElementById(describedBy)?.textContent).toBe('E-mail is required');
    expect(onSignedIn).not.toHaveBeenCalled();
  });

  it('explains a malformed address', async () => {
    const user = userEvent.setup();
    renderForm();
    await user.type(screen.getByLabelText('E-mail'), 'not-an-address');
    await user.type(screen.getByLabelText('Password'), 'something');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));
    expect(await screen.findByText('Enter an e-mail address like name@example.org')).toBeTruthy();
  });
});
