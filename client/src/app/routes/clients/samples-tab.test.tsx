import { screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { ASHBY_ID, clientRecord, sampleSummary, sessionUser } from '@/testing/data';
import { type MockRoutes, mockFetch, type RecordedRequest, sessionRoutes } from '@/testing/mock-fetch';
import { renderApp } from '@/testing/render-app';

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
    expect(await screen.findByText('Choose at least one file to upload.')).toBeInTheDocument();

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
});
