import { redactionToken, type SampleDetail } from '@keyloom/shared';
import { screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { ASHBY_ID, clientRecord, SAMPLE_ID, sampleDetail, sampleSummary, sessionUser } from '@/testing/data';
import { type MockRoutes, mockFetch, sessionRoutes } from '@/testing/mock-fetch';
import { currentUrl, renderApp } from '@/testing/render-app';
import { profileVersion, VERSION_2_ID } from '@/features/profiles/testing/profile-data';
import { expectErrorSummary } from '@/testing/error-summary';

const sample = sampleDetail();
const [phone, email] = sample.flags;
if (!phone || !email) throw new Error('The fixture has two flags.');

const openSample = async (role: 'clinician' | 'supervisor' = 'clinician', routes: MockRoutes = {}) => {
  const api = mockFetch({
    ...sessionRoutes(sessionUser(role)),
    [`GET /api/samples/${SAMPLE_ID}`]: { body: sample },
    [`GET /api/clients/${ASHBY_ID}/profile-versions`]: { body: [] },
    ...routes,
  });
  const app = renderApp(`/clients/${ASHBY_ID}/samples/${SAMPLE_ID}`);
  await screen.findByRole('heading', { level: 1, name: 'Messages to the sailing club' });
  return { ...app, api };
};

// What the API answers after redacting the phone number: the span is replaced by the token.
const afterRedaction = (): SampleDetail => {
  const token = redactionToken('phone');
  const text = sample.text.slice(0, phone.start) + token + sample.text.slice(phone.end);
  const shift = token.length - (phone.end - phone.start);
  return {
    ...sample,
    text,
    openFlags: 1,
    flags: [
      {
        ...phone,
        end: phone.start + token.length,
        text: null,
        status: 'redacted',
        decidedBy: 'Dr. Tomasz Reyes',
        decidedAt: '2026-09-16T09:00:00.000Z',
      },
      { ...email, start: email.start + shift, end: email.end + shift },
    ],
  };
};

describe('Sample page', () => {
  it('shows the statistics and the client’s own words', async () => {
    await openSample();
    const figures = screen.getAllByRole('definition').map((item) => item.textContent);
    expect(figures).toEqual(['96', '18', '17']);
    const top = screen.getByRole('heading', { name: 'Most frequent words' })
      .nextElementSibling as HTMLElement;
    expect(
      within(top)
        .getAllByRole('listitem')
        .map((item) => item.textContent),
    ).toEqual(['the ×1', 'race ×1']);
    expect(screen.getByRole('heading', { name: 'The client’s own words (1)' })).toBeInTheDocument();
    expect(screen.getByText('Pepper')).toBeInTheDocument();
  });

  it('marks each flag in the text as a button that leads to its decision', async () => {
    const { user } = await openSample();
    const mark = screen.getByRole('button', { name: /^Phone number, to review: ?07700 900123$/ });
    expect(mark.closest('mark')).not.toBeNull();
    await user.click(mark);
    expect(screen.getByRole('article', { name: 'Phone number: 07700 900123' })).toHaveFocus();
  });

  it('previews a redaction (before → after) and sends nothing until it is confirmed', async () => {
    const { user, api } = await openSample();
    await user.click(screen.getByRole('button', { name: 'Redact phone number 07700 900123…' }));
    const dialog = within(await screen.findByRole('dialog', { name: 'Redact this?' }));
    const now = dialog.getByText('Now').nextElementSibling as HTMLElement;
    const after = dialog.getByText('After redaction').nextElementSibling as HTMLElement;
    expect(within(now).getByText('07700 900123').tagName).toBe('MARK');
    expect(within(after).getByText(redactionToken('phone')).tagName).toBe('MARK');
    // The same words around the span on both sides (the fixture's text, not a copy of the code).
    expect(now.textContent?.replace('07700 900123', '#')).toBe(
      after.textContent?.replace(redactionToken('phone'), '#'),
    );
    await user.click(dialog.getByRole('button', { name: 'Cancel' }));
    expect(api.requestsTo(`POST /api/samples/${SAMPLE_ID}/flags/${phone.id}`)).toHaveLength(0);
  });

  it('redacts a flag, shows the placeholder and announces it', async () => {
    const { user, api } = await openSample('clinician', {
      [`POST /api/samples/${SAMPLE_ID}/flags/${phone.id}`]: { body: afterRedaction() },
    });
    await user.click(screen.getByRole('button', { name: 'Redact phone number 07700 900123…' }));
    const dialog = within(await screen.findByRole('dialog', { name: 'Redact this?' }));
    await user.click(dialog.getByRole('button', { name: 'Redact' }));
    await waitFor(() =>
      expect(screen.getByRole('status')).toHaveTextContent(
        `Redacted the phone number; the text now reads ${redactionToken('phone')} there.`,
      ),
    );
    expect(api.requestsTo(`POST /api/samples/${SAMPLE_ID}/flags/${phone.id}`)[0]?.body).toEqual({
      action: 'redact',
      reason: null,
    });
    expect(screen.queryByRole('button', { name: /Phone number, to review/ })).not.toBeInTheDocument();
    expect(screen.getByText('1 flag still to review.')).toBeInTheDocument();
    await waitFor(() =>
      expect(screen.getByRole('article', { name: `Phone number: ${redactionToken('phone')}` })).toHaveFocus(),
    );
  });

  it('undoes a redaction: the original text is back and focus stays on the flag', async () => {
    const redacted = afterRedaction();
    const { user, api } = await openSample('clinician', {
      [`GET /api/samples/${SAMPLE_ID}`]: { body: redacted },
      [`POST /api/samples/${SAMPLE_ID}/flags/${phone.id}/undo`]: { body: sample },
    });
    expect(screen.getByText('1 flag still to review.')).toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: 'Undo redaction of phone number' }));
    await waitFor(() =>
      expect(screen.getByRole('status')).toHaveTextContent(
        'Undid the redaction: the phone number is back in the text and waits for a decision.',
      ),
    );
    expect(api.requestsTo(`POST /api/samples/${SAMPLE_ID}/flags/${phone.id}/undo`)).toHaveLength(1);
    expect(
      screen.getByRole('button', { name: /^Phone number, to review: ?07700 900123$/ }),
    ).toBeInTheDocument();
    expect(screen.getByText('2 flags still to review.')).toBeInTheDocument();
    await waitFor(() =>
      expect(screen.getByRole('article', { name: 'Phone number: 07700 900123' })).toHaveFocus(),
    );
  });

  it('says why an undo was refused (a version trained since) and keeps the redaction', async () => {
    const message =
      'A version was trained on this sample after the redaction, so the original text is gone; the redaction stays.';
    const { user } = await openSample('clinician', {
      [`GET /api/samples/${SAMPLE_ID}`]: { body: afterRedaction() },
      [`POST /api/samples/${SAMPLE_ID}/flags/${phone.id}/undo`]: {
        status: 409,
        body: { statusCode: 409, message },
      },
    });
    await user.click(screen.getByRole('button', { name: 'Undo redaction of phone number' }));
    await waitFor(() => expect(screen.getByRole('status')).toHaveTextContent(message));
    expect(screen.getByText('1 flag still to review.')).toBeInTheDocument();
  });

  it('includes a left-out sample again and moves focus to its status', async () => {
    const excluded = { ...sample, status: 'excluded' as const, excludedReason: 'Written by his sister.' };
    const { user, api } = await openSample('clinician', {
      [`GET /api/samples/${SAMPLE_ID}`]: { body: excluded },
      [`POST /api/samples/${SAMPLE_ID}/include`]: { body: sampleSummary({ status: 'needs_review' }) },
    });
    expect(screen.getByText(/Reason: Written by his sister\./)).toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Undo redaction of phone number' })).not.toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: 'Include again' }));
    await waitFor(() => expect(screen.getByRole('status')).toHaveTextContent('is included again.'));
    expect(api.requestsTo(`POST /api/samples/${SAMPLE_ID}/include`)).toHaveLength(1);
    await waitFor(() => expect(document.getElementById('sample-status')).toHaveFocus());
  });

  it('keeps a flag only with a reason', async () => {
    const kept = {
      ...sample,
      flags: [phone, { ...email, status: 'kept' as const, reason: 'The club’s public address.' }],
    };
    const { user, api } = await openSample('clinician', {
      [`POST /api/samples/${SAMPLE_ID}/flags/${email.id}`]: { body: kept },
    });
    await user.click(screen.getByRole('button', { name: 'Keep e-mail address rob@harbour.example' }));
    const form = within(await screen.findByRole('dialog', { name: 'Keep this in the text?' }));
    await user.click(form.getByRole('button', { name: 'Keep it' }));
    // Message from flagDecisionSchema (shared/src/schemas/samples.schema.ts).
    expect(await form.findByText('Say why this stays in the text.')).toBeInTheDocument();
    expect(api.requestsTo(`POST /api/samples/${SAMPLE_ID}/flags/${email.id}`)).toHaveLength(0);

    await user.type(form.getByLabelText('Reason for keeping it'), 'The club’s public address.');
    await user.click(form.getByRole('button', { name: 'Keep it' }));
    await waitFor(() =>
      expect(screen.getByRole('status')).toHaveTextContent('Kept the e-mail address with your reason.'),
    );
    expect(api.requestsTo(`POST /api/samples/${SAMPLE_ID}/flags/${email.id}`)[0]?.body).toEqual({
      action: 'keep',
      reason: 'The club’s public address.',
    });
    expect(screen.getByText('Reason: The club’s public address.')).toBeInTheDocument();
  });

  it('leaves a sample out only with a reason', async () => {
    const { user, api } = await openSample('clinician', {
      [`POST /api/samples/${SAMPLE_ID}/exclude`]: {
        body: sampleSummary({ status: 'excluded', excludedReason: 'Written by his sister.' }),
      },
    });
    await user.click(screen.getByRole('button', { name: 'Leave out this sample' }));
    const form = within(await screen.findByRole('dialog'));
    await user.click(form.getByRole('button', { name: 'Leave out this sample' }));
    expect(await form.findByText('Say why the sample is left out.')).toBeInTheDocument();
    await user.type(form.getByLabelText('Reason for leaving it out'), 'Written by his sister.');
    await user.click(form.getByRole('button', { name: 'Leave out this sample' }));
    await waitFor(() => expect(screen.getByRole('status')).toHaveTextContent('is left out.'));
    expect(api.requestsTo(`POST /api/samples/${SAMPLE_ID}/exclude`)[0]?.body).toEqual({
      reason: 'Written by his sister.',
    });
  });

  it('gives a supervisor the text and flags without decision buttons', async () => {
    await openSample('supervisor');
    expect(screen.getByRole('article', { name: 'Phone number: 07700 900123' })).toBeInTheDocument();
    expect(screen.queryByRole('button', { name: /^Redact/ })).not.toBeInTheDocument();
    expect(screen.queryByRole('button', { name: /^Keep/ })).not.toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Leave out this sample' })).not.toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Delete sample…' })).not.toBeInTheDocument();
  });

  describe('deleting the sample', () => {
    // A draft that never started training holds the sample: deleting is still allowed.
    const untrainedDraft = profileVersion({
      status: 'draft',
      trainedAt: null,
      history: [{ status: 'draft', at: '2026-09-21T09:00:00.000Z', by: 'Dr. Tomasz Reyes', comment: null }],
    });

    it('deletes with a reason, then opens the samples list with focus on its heading and says so', async () => {
      let deleted = false;
      const { user, api, router } = await openSample('clinician', {
        [`GET /api/clients/${ASHBY_ID}/profile-versions`]: { body: [untrainedDraft] },
        [`DELETE /api/samples/${SAMPLE_ID}`]: () => {
          deleted = true;
          return { status: 204 };
        },
        [`GET /api/clients/${ASHBY_ID}`]: { body: clientRecord() },
        [`GET /api/clients/${ASHBY_ID}/samples`]: () => ({ body: deleted ? [] : [sampleSummary()] }),
      });
      const button = await screen.findByRole('button', { name: 'Delete sample…' });
      await waitFor(() => expect(button).toBeEnabled());
      await user.click(button);
      const dialog = await screen.findByRole('dialog', { name: 'Delete “Messages to the sailing club”?' });
      await user.click(within(dialog).getByRole('button', { name: 'Delete sample' }));
      // Message from deleteSampleSchema (shared/src/schemas/samples.schema.ts).
      await expectErrorSummary(dialog, 'One field needs attention', [
        'Reason for deleting it: Say why the sample is deleted.',
      ]);
      expect(api.requestsTo(`DELETE /api/samples/${SAMPLE_ID}`)).toHaveLength(0);

      await user.type(
        within(dialog).getByLabelText('Reason for deleting it'),
        'Uploaded to the wrong client.',
      );
      await user.click(within(dialog).getByRole('button', { name: 'Delete sample' }));
      await waitFor(() => expect(currentUrl(router)).toBe(`/clients/${ASHBY_ID}/samples`));
      expect(api.requestsTo(`DELETE /api/samples/${SAMPLE_ID}`)[0]?.body).toEqual({
        reason: 'Uploaded to the wrong client.',
      });
      const heading = await screen.findByRole('heading', { name: 'Samples of R. Ashby' });
      await waitFor(() => expect(heading).toHaveFocus());
      expect(screen.getByRole('status')).toHaveTextContent('“Messages to the sailing club” was deleted.');
    });

    it('is switched off, saying why, once a version was trained on the sample', async () => {
      const { api } = await openSample('clinician', {
        [`GET /api/clients/${ASHBY_ID}/profile-versions`]: {
          body: [untrainedDraft, profileVersion({ id: VERSION_2_ID, number: 2 })],
        },
      });
      const button = screen.getByRole('button', { name: 'Delete sample…' });
      await waitFor(() =>
        expect(button).toHaveAccessibleDescription(
          'Cannot be deleted. Version 2 was trained on it: leave it out of future versions instead.',
        ),
      );
      expect(button).toBeDisabled();
      expect(api.requestsTo(`DELETE /api/samples/${SAMPLE_ID}`)).toHaveLength(0);
    });
  });
});
