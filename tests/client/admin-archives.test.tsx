import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { CSRF_TOKEN, fakeApi, sessionRoutes } from './helpers/fake-api.ts';
import { ORRERY, SPARE, admin, planner } from './helpers/fixtures.ts';
import { renderApp } from './helpers/render-app.tsx';

const PRODUCTIONS = {
  productions: [
    { id: ORRERY, name: 'Orrery Seven tour', venues: [] },
    { id: SPARE, name: 'Workshop rebuild', venues: [] },
  ],
};

/** A stand-in for XMLHttpRequest (jsdom has no server to send to): reports progress, then answers. */
class FakeXhr {
  static sent: { url: string; headers: Record<string, string>; body: FormData }[] = [];
  static answer: { status: number; body: unknown } = { status: 201, body: {} };
  status = 0;
  responseText = '';
  withCredentials = false;
  upload: { onprogress?: (e: { loaded: number; total: number; lengthComputable: boolean }) => void } = {};
  onload?: () => void;
  onerror?: () => void;
  private url = '';
  private headers: Record<string, string> = {};
  open(_method: string, url: string) {
    this.url = url;
  }
  setRequestHeader(k: string, v: string) {
    this.headers[k] = v;
  }
  send(body: FormData) {
    FakeXhr.sent.push({ url: this.url, headers: this.headers, body });
    setTimeout(() => {
      this.upload.onprogress?.({ loaded: 50, total: 100, lengthComputable: true });
      setTimeout(() => {
        this.status = FakeXhr.answer.status;
        this.responseText = JSON.stringify(FakeXhr.answer.body);
        this.onload?.();
      }, 20);
    }, 10);
  }
}

afterEach(() => {
  FakeXhr.sent = [];
  vi.unstubAllGlobals();
});

function chooseFile(name: string) {
  const input = screen.getByLabelText('Archive file') as HTMLInputElement;
  fireEvent.change(input, { target: { files: [new File([new Uint8Array([0x1f, 0x8b, 1, 2])], name, { type: 'application/gzip' })] } });
}

describe('admin archives screen', () => {
  it('offers a download link per production', async () => {
    fakeApi({ ...sessionRoutes(admin), 'GET /api/admin/productions': { body: PRODUCTIONS } });
    renderApp('/admin/archives');
    const list = await screen.findByRole('list', { name: 'Productions' });
    const link = within(list).getByRole('link', { name: 'Download archive of Workshop rebuild' });
    expect(link.getAttribute('href')).toBe(`/api/productions/${SPARE}/archive`);
    expect(link.hasAttribute('download')).toBe(true);
    expect(within(list).getAllByRole('link')).toHaveLength(2);
  });

  it('uploads an archive with progress and reports what was restored', async () => {
    fakeApi({ ...sessionRoutes(admin), 'GET /api/admin/productions': { body: PRODUCTIONS }, 'GET /api/admin/users': { body: { users: [] } } });
    vi.stubGlobal('XMLHttpRequest', FakeXhr);
    FakeXhr.answer = { status: 201, body: { production: { id: ORRERY, name: 'Orrery Seven tour' }, tables: [{ name: 'crates', rows: 20 }, { name: 'venues', rows: 8 }], files: 4, users: { added: 4, existing: 0, matchedByEmail: 0 } } };
    renderApp('/admin/archives');
    await screen.findByRole('heading', { name: 'Restore an archive' });
    chooseFile('orrery.tar.gz');
    fireEvent.click(screen.getByRole('button', { name: 'Restore' }));
    expect(await screen.findByRole('progressbar', { name: 'Upload progress' })).toBeTruthy();
    const done = await screen.findByText('Restored "Orrery Seven tour"');
    expect(done.parentElement!.textContent).toMatch(/28 rows in 2 tables and 4 files/);
    expect(done.parentElement!.textContent).toMatch(/4 people were added without a password/);
    expect(FakeXhr.sent).toHaveLength(1);
    expect(FakeXhr.sent[0].url).toBe('/api/archive/restore');
    expect(FakeXhr.sent[0].headers['x-csrf-token']).toBe(CSRF_TOKEN);
    expect((FakeXhr.sent[0].body.get('archive') as File).name).toBe('orrery.tar.gz');
  });

  it('shows the server\u2019s refusal, and refuses a file that is not an archive before sending it', async () => {
    fakeApi({ ...sessionRoutes(admin), 'GET /api/admin/productions': { body: PRODUCTIONS } });
    vi.stubGlobal('XMLHttpRequest', FakeXhr);
    renderApp('/admin/archives');
    await screen.findByRole('heading', { name: 'Restore an archive' });
    chooseFile('photo.png');
    fireEvent.click(screen.getByRole('button', { name: 'Restore' }));
    expect((await screen.findByRole('alert')).textContent).toMatch(/"photo.png" is not a production archive/);
    expect(FakeXhr.sent).toHaveLength(0);

    FakeXhr.answer = { status: 400, body: { error: { code: 'archive_checksum', message: 'Entry "tables/crates.jsonl" does not match its SHA-256 in the manifest.' } } };
    chooseFile('orrery.tgz');
    fireEvent.click(screen.getByRole('button', { name: 'Restore' }));
    await waitFor(() => expect(screen.getByRole('alert').textContent).toMatch(/tables\/crates\.jsonl/));
    expect(screen.getByRole('alert').textContent).toMatch(/was not restored/);
  });

  it('is not offered to a planner', async () => {
    const api = fakeApi({ ...sessionRoutes(planner), 'GET /api/admin/productions': { body: PRODUCTIONS } });
    renderApp('/admin/archives');
    expect(await screen.findByText('This screen is not part of your role')).toBeTruthy();
    expect(api.callsTo('GET /api/admin/productions')).toHaveLength(0);
  });
});
