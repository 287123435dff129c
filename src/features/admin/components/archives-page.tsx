import { useId, useRef, useState, type FormEvent } from 'react';
import { Alert, Button, Card, EmptyState, ErrorState, PageHeader, PageLoading, buttonClasses } from '../../../components/ui/index.ts';
import { errorMessage } from '../../../lib/api.ts';
import { useAllProductions } from '../api/get-productions.ts';
import { uploadedShare } from '../../../lib/upload.ts';
import { ARCHIVE_EXTENSIONS, archiveDownloadUrl, useRestoreArchive, type UploadProgress } from '../api/restore-archive.ts';

/** Download each production as one archive file; restore an archive into this installation. */
export function ArchivesPage() {
  const productions = useAllProductions();
  return (
    <div className="flex flex-col gap-5">
      <PageHeader
        eyebrow="Company"
        title="Archives"
        description="A production's archive is one file with all of its data and uploads: the machine, crates, loads, tour, venues, lift plans and sign-offs, gear, check-ins, and the people it names (without their passwords)."
      />
      <Card title="Download a production">
        {productions.isPending ? (
          <PageLoading label="Loading productions…" />
        ) : productions.isError ? (
          <ErrorState title="The productions could not be loaded" error={productions.error} onRetry={() => productions.refetch()} retrying={productions.isFetching} />
        ) : productions.data.length === 0 ? (
          <EmptyState title="No productions yet">Restore an archive below, or create a production.</EmptyState>
        ) : (
          <ul className="divide-y divide-ink-100" aria-label="Productions">
            {productions.data.map((p) => (
              <li key={p.id} className="flex flex-wrap items-center justify-between gap-3 py-3">
                <span className="font-semibold text-ink-900">{p.name}</span>
                <a className={buttonClasses({ variant: 'secondary', size: 'sm' })} href={archiveDownloadUrl(p.id)} download>
                  Download archive <span className="sr-only">of {p.name}</span>
                </a>
              </li>
            ))}
          </ul>
        )}
      </Card>
      <RestoreCard />
    </div>
  );
}

const percent = (p: UploadProgress | null): number => Math.round(uploadedShare(p) * 100);

function RestoreCard() {
  const inputId = useId();
  const input = useRef<HTMLInputElement>(null);
  const [file, setFile] = useState<File | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const [progress, setProgress] = useState<UploadProgress | null>(null);
  const restore = useRestoreArchive(setProgress);

  function submit(event: FormEvent<HTMLFormElement>) {
    event.preventDefault();
    if (!file) return setProblem('Choose an archive file first.');
    if (!ARCHIVE_EXTENSIONS.some((ext) => file.name.toLowerCase().endsWith(ext))) {
      return setProblem(`"${file.name}" is not a production archive; choose the ${ARCHIVE_EXTENSIONS.join(' or ')} file that "Download archive" saved.`);
    }
    setProblem(null);
    setProgress({ loadedBytes: 0, totalBytes: file.size });
    restore.mutate(file, {
      onSuccess: () => {
        setFile(null);
        if (input.current) input.current.value = '';
      },
    });
  }

  const result = restore.isSuccess ? restore.data : null;
  return (
    <Card title="Restore an archive" description="Adds the production with the same ids, all at once or not at all. Its id must not already exist here, and this installation must be at the same version as the one that made the archive.">
      <form noValidate onSubmit={submit} className="flex flex-col gap-4">
        {result && (
          <Alert tone="ok" title={`Restored "${result.production.name}"`}>
            {result.tables.reduce((s, t) => s + t.rows, 0)} rows in {result.tables.length} tables and {result.files} files.{' '}
            {result.users.added > 0 && `${result.users.added} people were added without a password: they choose one with "Forgot password". `}
            {result.users.matchedByEmail > 0 && `${result.users.matchedByEmail} matched people already here by e-mail.`}
          </Alert>
        )}
        {(problem || restore.isError) && (
          <Alert tone="danger" title="The archive was not restored">
            {problem ?? errorMessage(restore.error)}
          </Alert>
        )}
        <div className="flex flex-col gap-1">
          <label htmlFor={inputId} className="text-sm font-semibold text-ink-800">
            Archive file
          </label>
          <input
            id={inputId}
            ref={input}
            type="file"
            accept={ARCHIVE_EXTENSIONS.join(',')}
            className="text-sm"
            onChange={(e) => {
              setFile(e.target.files?.[0] ?? null);
              setProblem(null);
              restore.reset();
            }}
          />
        </div>
        {restore.isPending && (
          <div className="flex flex-col gap-1">
            <progress max={100} value={percent(progress)} aria-label="Upload progress" className="w-full" />
            <p className="text-sm text-ink-600">
              {percent(progress) < 100 ? `Uploading… ${percent(progress)}%` : 'Checking and restoring…'}
            </p>
          </div>
        )}
        <div>
          <Button type="submit" loading={restore.isPending} disabled={restore.isPending}>
            Restore
          </Button>
        </div>
      </form>
    </Card>
  );
}
