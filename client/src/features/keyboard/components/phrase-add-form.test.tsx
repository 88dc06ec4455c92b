import { render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { describe, expect, it, vi } from 'vitest';
import { AppProvider } from '@/app/provider';
import { createAppQueryClient } from '@/app/query-client';
import { mockFetch } from '@/testing/mock-fetch';
import { PhraseAddForm } from './phrase-add-form';

// The form validates with the shared createPracticePhraseSchema, so the API's text rule (no NUL, no
// unpaired surrogate) reaches the person as the field's own message before anything is sent.
const CLIENT_ID = '6b1c3d9e-8f2a-4b7c-9d1e-2a3b4c5d6e10';

const renderForm = () => {
  const onAdded = vi.fn();
  const user = userEvent.setup();
  render(
    <AppProvider queryClient={createAppQueryClient({ retry: false })}>
      <PhraseAddForm clientId={CLIENT_ID} pseudonym="R. Hollin" onAdded={onAdded} />
    </AppProvider>,
  );
  return { user, onAdded };
};

describe('PhraseAddForm', () => {
  it('shows the shared message for a broken character and sends nothing', async () => {
    const api = mockFetch({});
    const { user, onAdded } = renderForm();
    const field = screen.getByLabelText('New practice phrase');

    await user.click(field);
    await user.paste('hello \ud800 there');
    await user.click(screen.getByRole('button', { name: 'Add phrase' }));

    const message = 'Contains a broken character (unpaired surrogate).';
    expect(await screen.findByText(message)).toBeInTheDocument();
    expect(field).toHaveAttribute('aria-invalid', 'true');
    expect(field).toHaveAccessibleDescription(expect.stringContaining(message));
    expect(api.requestsTo(`POST /api/clients/${CLIENT_ID}/practice-phrases`)).toHaveLength(0);
    expect(onAdded).not.toHaveBeenCalled();
  });

  it('shows the shared message for a control character', async () => {
    mockFetch({});
    const { user } = renderForm();
    await user.click(screen.getByLabelText('New practice phrase'));
    await user.paste('see you\u0007soon');
    await user.click(screen.getByRole('button', { name: 'Add phrase' }));
    expect(await screen.findByText('Contains a character that cannot be stored (BEL).')).toBeInTheDocument();
  });
});
