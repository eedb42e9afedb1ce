// The import zones of eslint.config.js, run through ESLint's Node API on small sources placed at
// real paths of the tree: each import across a zone must be reported, and an allowed one must not.
import path from 'node:path';
import { ESLint } from 'eslint';
import tseslint from 'typescript-eslint';

const root = path.join(__dirname, '..', '..');
// The project's config, handed over as an object: Jest cannot run ESLint's own config loader
// (a dynamic import). Type information is not needed for the zones; leaving it out keeps this quick.
// eslint-disable-next-line @typescript-eslint/no-require-imports -- the config is a CommonJS file outside the TypeScript tree
const projectConfig = require(path.join(root, 'eslint.config.js')) as ESLint.Options['baseConfig'];
const eslint = new ESLint({
  cwd: root,
  overrideConfigFile: true,
  baseConfig: projectConfig,
  // no-cycle reads the probe's file from disk, and the probes exist only as text
  overrideConfig: [tseslint.configs.disableTypeChecked, { rules: { 'import/no-cycle': 'off' } }],
});

async function zoneErrors(filePath: string, source: string): Promise<string[]> {
  const [result] = await eslint.lintText(source, { filePath: path.join(root, filePath) });
  return result.messages.filter((m) => m.ruleId === 'import/no-restricted-paths').map((m) => m.message);
}

describe('import zones', () => {
  it('when a shared component imports a feature, then lint reports it', async () => {
    const errors = await zoneErrors('src/components/zone-probe.ts', "export { parseDraft } from '@/features/requests/draft-store';\n");
    expect(errors).toHaveLength(1);
    expect(errors[0]).toMatch(/Only routes import features/);
  });

  it('when a feature imports another feature, then lint reports it', async () => {
    const errors = await zoneErrors('src/features/tools/zone-probe.ts', "export * from '@/features/requests/hooks';\n");
    expect(errors).toHaveLength(1);
    expect(errors[0]).toMatch(/never imports another feature/);
  });

  it('when a feature imports its own files, the API client and shared code, then lint is quiet', async () => {
    const errors = await zoneErrors(
      'src/features/requests/zone-probe.ts',
      "export * from './hooks';\nexport { apiRequest } from '@/api/client';\nexport * from '@shared/domain/lifecycle';\n",
    );
    expect(errors).toEqual([]);
  });

  it('when server code imports client code, then lint reports it', async () => {
    const errors = await zoneErrors('server/lib/zone-probe.ts', "export * from '../../src/lib/registry-format';\n");
    expect(errors).toHaveLength(1);
    expect(errors[0]).toMatch(/server never imports client code/);
  });

  it('when client code imports server code, then lint reports it', async () => {
    const errors = await zoneErrors('src/lib/zone-probe.ts', "export * from '../../server/lib/canonical-json';\n");
    expect(errors).toHaveLength(1);
    expect(errors[0]).toMatch(/client never imports server code/);
  });

  it('when shared code imports the server, then lint reports it', async () => {
    const errors = await zoneErrors('shared/domain/zone-probe.ts', "export * from '../../server/lib/canonical-json';\n");
    expect(errors).toHaveLength(1);
  });

  it('when anything imports a route file, then lint reports it', async () => {
    const errors = await zoneErrors('src/lib/zone-probe.ts', "export { default } from '../../app/sign-in';\n");
    expect(errors).toHaveLength(1);
    expect(errors[0]).toMatch(/Route files are not imported/);
  });

  it('when the API layer imports a screen building block, then lint reports it', async () => {
    const errors = await zoneErrors('src/api/zone-probe.ts', "export * from '@/lib/registry-format';\n");
    expect(errors).toHaveLength(1);
  });
});
