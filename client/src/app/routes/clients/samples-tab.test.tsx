import { screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { ASHBY_ID, clientRecord, sampleSummary, sessionUser } from '@/testing/data';
import { type MockRoutes, mockFetch, type RecordedRequest, sessionRoutes } from '@/testing/mock-fetch';
import { renderApp } from '@/testing/render-app';
import { profileVersion, VERSION_2_ID } from '@/features/profiles/testing/profile-data';

const base = `/api/clients/${ASHBY_ID}`;

const openSamplesTab = async (routes: MockRoutes = {}, client = clientRecord()) => {
  const api = mockFetch({
    ...sessionRoutes(sessionUser('clinician')),
    [`GET ${base}`]: { body: client },
    [`GET ${base}/samples`]: { body: [] },
    ...routes,
  });
  const app = renderApp(`/clients/${ASHBY_ID}/samples`);
  await screen.findByRole('heading', { name: 'No writing samples yet.' });
  return { ...app, api };
};

const textFile = (name: string, text: string, type = 'text/plain') => new File([text], name, { type });

// One stored sample per uploaded file, as the API answers (uploadResultSchema).
const storedAnswer = (request: RecordedRequest) => {
  const file = request.formData?.get('files');
  const name = file instanceof File ? file.name : 'unknown';
  if (name === 'scan.txt') {
    return {
      status: 400,
      body: {
        statusCode: 400,
        message: 'scan.txt is not text: it looks like a PNG image. Upload plain text or CSV.',
      },
    };
  }
  if (name === 'again.txt') {
    return {
      status: 201,
      body: {
        samples: [],
        duplicates: [
          {
            fileName: 'again.txt',
            existingSampleId: '9c4d5e6f-7a8b-4c0d-9e2f-3a4b5c6d7e81',
            message: 'again.txt was uploaded before; it is not stored twice.',
          },
        ],
      },
    };
  }
  return {
    status: 201,
    body: { samples: [sampleSummary({ title: name.replace(/\.\w+$/, ''), fileName: name })], duplicates: [] },
  };
};

describe('Writing samples tab', () => {
  it('shows the personal-health-information caution', async () => {
    await openSamplesTab();
    expect(screen.getByText('These samples are personal health information.')).toBeInTheDocument();
  });

  it('switches uploading off without an active training consent, says why and links to the consent tab', async () => {
    await openSamplesTab({}, clientRecord({ consentStatus: 'none', trainingConsent: false }));
    const button = screen.getByRole('button', { name: 'Upload files' });
    expect(button).toBeDisabled();
    expect(button).toHaveAccessibleDescription(/has no active consent for model training/);
    expect(screen.getByRole('link', { name: /Record consent on the Consent & family tab/ })).toHaveAttribute(
      'href',
      `/clients/${ASHBY_ID}/consent`,
    );
    expect(screen.queryByLabelText(/Choose files/)).not.toBeInTheDocument();
  });

  it('takes files from the keyboard-operable file input, sends each on its own and shows each answer beside it', async () => {
    const { user, api } = await openSamplesTab({ [`POST ${base}/samples`]: storedAnswer });
    const input = screen.getByLabelText(/Choose files, or drop them here/);
    expect(input).toHaveAttribute('type', 'file');
    // A real input, so Tab reaches it and Enter or Space opens the picker.
    input.focus();
    expect(input).toHaveFocus();

    await user.upload(input, [
      textFile('diary.txt', 'Pepper and I went down to the harbour.'),
      textFile('scan.txt', 'not really text'),
      textFile('again.txt', 'Sent this one before.'),
    ]);
    const list = within(screen.getByRole('list', { name: 'Chosen files' }));
    expect(list.getAllByRole('listitem')).toHaveLength(3);

    await user.selectOptions(screen.getByLabelText('Where the text came from'), 'Diary');
    await user.click(screen.getByRole('button', { name: 'Upload files' }));

    await waitFor(() =>
      expect(screen.getByRole('status')).toHaveTextContent(
        '1 file stored, 2 not stored — see the list for why.',
      ),
    );
    const items = list.getAllByRole('listitem');
    expect(items[0]).toHaveTextContent('Stored');
    expect(items[1]).toHaveTextContent('Refused');
    expect(items[1]).toHaveTextContent('scan.txt is not text: it looks like a PNG image.');
    expect(items[2]).toHaveTextContent('Already uploaded');
    expect(items[2]).toHaveTextContent('again.txt was uploaded before; it is not stored twice.');

    const posts = api.requestsTo(`POST ${base}/samples`);
    expect(posts).toHaveLength(3);
    expect(posts.map((post) => (post.formData?.get('files') as File).name)).toEqual([
      'diary.txt',
      'scan.txt',
      'again.txt',
    ]);
    expect(posts[0]?.formData?.get('sourceKind')).toBe('diary');
    expect(posts[0]?.formData?.has('csvColumn')).toBe(false);
  });

  it('asks for the CSV column only when a .csv file is chosen, and sends it with that file', async () => {
    const { user, api } = await openSamplesTab({ [`POST ${base}/samples`]: storedAnswer });
    expect(screen.queryByLabelText('CSV column with the text')).not.toBeInTheDocument();
    await user.upload(screen.getByLabelText(/Choose files/), [
      textFile('chat.csv', 'sent_at,message\n2026-08-01,Off to sail\n', 'text/csv'),
    ]);
    await user.type(screen.getByLabelText('CSV column with the text'), 'message');
    await user.click(screen.getByRole('button', { name: 'Upload files' }));
    await waitFor(() => expect(screen.getByRole('status')).toHaveTextContent('1 file stored.'));
    expect(api.requestsTo(`POST ${base}/samples`)[0]?.formData?.get('csvColumn')).toBe('message');
  });

  it('refuses an empty file before sending it, and asks for a file when none is chosen', async () => {
    const { user, api } = await openSamplesTab({ [`POST ${base}/samples`]: storedAnswer });
    await user.click(screen.getByRole('button', { name: 'Upload files' }));
    // No file chosen is refused like any field: listed at the top of the form, focused, linked to the picker.
    const summary = await screen.findByRole('group', { name: 'One field needs attention' });
    await waitFor(() => expect(summary).toHaveFocus());
    const picker = screen.getByLabelText('Choose files, or drop them here');
    expect(picker).toHaveAttribute('aria-invalid', 'true');
    expect(picker).toHaveAccessibleDescription(/Choose at least one file to upload\./);
    await user.click(
      within(summary).getByRole('link', {
        name: 'Choose files, or drop them here: Choose at least one file to upload.',
      }),
    );
    expect(picker).toHaveFocus();

    await user.upload(screen.getByLabelText(/Choose files/), [textFile('empty.txt', '')]);
    expect(screen.getByText(/The file is empty/)).toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: 'Upload files' }));
    await waitFor(() => expect(screen.getByRole('status')).toHaveTextContent('0 files stored, 1 not stored'));
    expect(api.requestsTo(`POST ${base}/samples`)).toHaveLength(0);
  });

  it('stores pasted text as JSON with its title and source', async () => {
    const { user, api } = await openSamplesTab({ [`POST ${base}/samples`]: storedAnswer });
    await user.click(screen.getByRole('button', { name: 'Paste text' }));
    await user.click(screen.getByRole('button', { name: 'Store pasted text' }));
    expect(await screen.findByText('Give the sample a title.')).toBeInTheDocument();
    expect(screen.getByText('Paste some text.')).toBeInTheDocument();

    await user.type(screen.getByLabelText('Title'), 'Chat with Hannah');
    await user.type(screen.getByLabelText('Text'), 'See you at the jazz night.');
    await user.click(screen.getByRole('button', { name: 'Store pasted text' }));
    await waitFor(() => expect(screen.getByRole('status')).toHaveTextContent('Stored the pasted text'));
    expect(api.requestsTo(`POST ${base}/samples`)[0]?.body).toEqual({
      title: 'Chat with Hannah',
      sourceKind: 'messages',
      periodStart: null,
      periodEnd: null,
      note: null,
      text: 'See you at the jazz night.',
    });
  });

  describe('correcting the list', () => {
    const OTHER_ID = '9c4d5e6f-7a8b-4c0d-9e2f-3a4b5c6d7e82';
    const wrong = sampleSummary({ id: OTHER_ID, title: 'Notes for another client', words: 1234 });
    const leftOut = sampleSummary({ status: 'excluded', excludedReason: 'Written by his sister.' });

    const openWithSamples = async (routes: MockRoutes) => {
      const app = await (async () => {
        const api = mockFetch({
          ...sessionRoutes(sessionUser('clinician')),
          [`GET ${base}`]: { body: clientRecord() },
          ...routes,
        });
        return { ...renderApp(`/clients/${ASHBY_ID}/samples`), api };
      })();
      await screen.findByRole('table', { name: /Language samples/ });
      return app;
    };

    it('shows why a sample is left out and includes it again, focus on its row', async () => {
      let included = false;
      const { user, api } = await openWithSamples({
        [`GET ${base}/samples`]: () => ({
          body: [included ? { ...leftOut, status: 'ready', excludedReason: null } : leftOut],
        }),
        [`POST /api/samples/${leftOut.id}/include`]: () => {
          included = true;
          return { body: { ...leftOut, status: 'ready', excludedReason: null } };
        },
      });
      expect(screen.getByText('Reason: Written by his sister.')).toBeInTheDocument();
      await user.click(screen.getByRole('button', { name: `Include again ${leftOut.title}` }));
      await waitFor(() => expect(screen.getByRole('status')).toHaveTextContent('is included again.'));
      expect(api.requestsTo(`POST /api/samples/${leftOut.id}/include`)).toHaveLength(1);
      await waitFor(() => expect(screen.getByRole('link', { name: leftOut.title })).toHaveFocus());
      await waitFor(() =>
        expect(screen.queryByText('Reason: Written by his sister.')).not.toBeInTheDocument(),
      );
      expect(
        screen.queryByRole('button', { name: `Include again ${leftOut.title}` }),
      ).not.toBeInTheDocument();
    });

    it('deletes a sample only with a reason, after saying what goes; focus on the list heading', async () => {
      let deleted = false;
      const { user, api } = await openWithSamples({
        [`GET ${base}/samples`]: () => ({ body: deleted ? [leftOut] : [wrong, leftOut] }),
        [`DELETE /api/samples/${OTHER_ID}`]: () => {
          deleted = true;
          return { status: 204 };
        },
      });
      await user.click(screen.getByRole('button', { name: `Delete sample ${wrong.title}` }));
      const dialog = within(await screen.findByRole('dialog', { name: `Delete “${wrong.title}”?` }));
      expect(dialog.getAllByRole('listitem').map((item) => item.textContent)).toEqual([
        'the sample’s text (1,234 words) and its statistics;',
        'its personal-data flags and the decisions on them;',
        'its place in draft versions that have not been trained.',
      ]);
      await user.click(dialog.getByRole('button', { name: 'Delete sample' }));
      // Message from deleteSampleSchema (shared/src/schemas/samples.schema.ts).
      expect(await dialog.findByText('Say why the sample is deleted.')).toBeInTheDocument();
      expect(api.requestsTo(`DELETE /api/samples/${OTHER_ID}`)).toHaveLength(0);

      await user.type(dialog.getByLabelText('Reason for deleting it'), 'Uploaded to the wrong client.');
      await user.click(dialog.getByRole('button', { name: 'Delete sample' }));
      await waitFor(() =>
        expect(screen.getByRole('status')).toHaveTextContent(`“${wrong.title}” was deleted.`),
      );
      expect(api.requestsTo(`DELETE /api/samples/${OTHER_ID}`)[0]?.body).toEqual({
        reason: 'Uploaded to the wrong client.',
      });
      await waitFor(() => expect(screen.getByRole('heading', { name: /^Samples of/ })).toHaveFocus());
      await waitFor(() => expect(screen.queryByRole('link', { name: wrong.title })).not.toBeInTheDocument());
    });

    it('shows the refusal in the dialog when a version was trained on the sample', async () => {
      const message = 'Version 3 was trained on it: leave it out of future versions instead.';
      const { user } = await openWithSamples({
        [`GET ${base}/samples`]: { body: [wrong] },
        [`DELETE /api/samples/${OTHER_ID}`]: { status: 409, body: { statusCode: 409, message } },
      });
      await user.click(screen.getByRole('button', { name: `Delete sample ${wrong.title}` }));
      const dialog = within(await screen.findByRole('dialog'));
      await user.type(dialog.getByLabelText('Reason for deleting it'), 'Wrong client.');
      await user.click(dialog.getByRole('button', { name: 'Delete sample' }));
      expect(await dialog.findByText(message)).toBeInTheDocument();
      // The dialog stays open (the page behind it is inert) and the row stays in the list.
      expect(screen.getByRole('link', { name: wrong.title, hidden: true })).toBeInTheDocument();
    });

    it('switches Delete off, saying why, on a sample a version was trained on', async () => {
      // Version 3 trained on the wrong client's notes; a draft that never trained holds the other one.
      const trained = profileVersion({
        number: 3,
        samples: [{ id: OTHER_ID, title: wrong.title, sha256: 'c'.repeat(64), characters: 7_000 }],
      });
      const draft = profileVersion({
        id: VERSION_2_ID,
        number: 4,
        status: 'draft',
        trainedAt: null,
        samples: [{ id: leftOut.id, title: leftOut.title, sha256: 'd'.repeat(64), characters: 9_000 }],
        history: [{ status: 'draft', at: '2026-10-01T09:00:00.000Z', by: 'Dr. Tomasz Reyes', comment: null }],
      });
      await openWithSamples({
        [`GET ${base}/samples`]: { body: [wrong, leftOut] },
        [`GET ${base}/profile-versions`]: { body: [draft, trained] },
      });
      const blocked = screen.getByRole('button', { name: `Delete sample ${wrong.title}` });
      await waitFor(() => expect(blocked).toBeDisabled());
      expect(blocked).toHaveAccessibleDescription(
        'Cannot be deleted. Version 3 was trained on it: leave it out of future versions instead.',
      );
      expect(screen.getByRole('button', { name: `Delete sample ${leftOut.title}` })).toBeEnabled();
    });
  });
});
