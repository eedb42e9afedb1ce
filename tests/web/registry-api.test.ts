// The registry's client calls: CSV goes out as text/csv, a refused run's report is kept, and equal
// filters make equal cache keys.
import { isApiError } from '@/api/errors';
import { importRegistryCsv, importReportOf, toolKeys, toolsExportUrl } from '@/api/registry';

function answer(status: number, body: unknown) {
  const text = JSON.stringify(body);
  return Promise.resolve({ ok: status >= 200 && status < 300, status, text: () => Promise.resolve(text) });
}

const report = {
  kind: 'tools',
  dryRun: false,
  applied: false,
  totalRows: 2,
  created: 1,
  updated: 0,
  unchanged: 0,
  errorRows: 1,
  fileErrors: [],
  rows: [
    { line: 2, key: 'KB-T-0600', action: 'create', errors: [] },
    { line: 3, key: 'KB-T-0601', action: 'error', errors: [{ column: 'mold_class', message: 'Mold classes run from 101 to 105' }] },
  ],
};

describe('registry API calls', () => {
  const realFetch = global.fetch;
  let fetchMock: jest.Mock;
  beforeEach(() => {
    fetchMock = jest.fn();
    global.fetch = fetchMock as unknown as typeof fetch;
  });
  afterEach(() => {
    global.fetch = realFetch;
  });

  it('when a CSV is checked, then it is posted as text/csv with the kind and dryRun in the query', async () => {
    fetchMock.mockReturnValue(answer(200, { ...report, dryRun: true, errorRows: 0, rows: [report.rows[0]] }));
    const csv = 'code,name\nKB-T-0600,Ranger Finch head\n';
    const result = await importRegistryCsv('tools', csv, true);
    expect(result.created).toBe(1);
    const [url, init] = fetchMock.mock.calls[0];
    expect(url).toBe('/api/registry/import?kind=tools&dryRun=true');
    expect(init).toMatchObject({ method: 'POST', body: csv, credentials: 'include' });
    expect(init.headers['Content-Type']).toBe('text/csv');
  });

  it('when a real run is refused with bad rows, then the error keeps the row-by-row report', async () => {
    fetchMock.mockReturnValue(answer(400, { error: { code: 'validation_failed', message: '1 row has problems; nothing was written', report } }));
    const error = await importRegistryCsv('tools', 'code\nx\n', false).catch((e: unknown) => e);
    expect(isApiError(error)).toBe(true);
    expect(importReportOf(error)?.rows[1]?.errors[0]?.column).toBe('mold_class');
  });

  it('when an error carries no report, then there is none to show', () => {
    expect(importReportOf(new Error('x'))).toBeNull();
    expect(importReportOf(null)).toBeNull();
  });

  it('when two filter sets differ only by empty values and spaces, then they share one cache key', () => {
    expect(toolKeys.list({ q: ' visor ', brandId: undefined, retentionDue: false })).toEqual(toolKeys.list({ q: 'visor' }));
    expect(toolKeys.list({ q: 'visor' })).not.toEqual(toolKeys.list({ q: 'visor', lifeBand: 'worn' }));
  });

  it('when the filtered list is exported, then the address carries the same filters', () => {
    expect(toolsExportUrl({ q: 'head', lifeBand: 'worn', retentionDue: true, retentionDays: 90 })).toBe(
      '/api/tools/export.csv?q=head&lifeBand=worn&retentionDue=true&retentionDays=90',
    );
  });
});
