import { Alert } from '@/components/ui/alert';
import { deviceFiles } from '../lib/vocabulary-lists';

/** "Files for the client's device": the version's words and word pairs as downloads. */
export const DeviceFiles = ({ versionId }: { versionId: string }) => (
  <section aria-labelledby="device-files-heading" className="flex flex-col gap-4">
    <h2 id="device-files-heading" className="text-2xl font-bold">
      Files for the client’s device
    </h2>
    <p className="max-w-3xl">
      The words this version offers, for loading into another device. Blocked words are left out; added words
      are in.
    </p>
    <Alert tone="info">
      These files hold the client’s personal words. Store and send them as you would the client’s records.
    </Alert>
    <ul className="flex flex-col gap-3">
      {deviceFiles(versionId).map((file) => (
        <li key={file.href} className="flex flex-col">
          <a
            href={file.href}
            download
            className="inline-flex min-h-11 w-fit items-center font-bold underline"
          >
            {file.label}
          </a>
          <span className="text-ink-soft">{file.columns}</span>
        </li>
      ))}
    </ul>
  </section>
);
