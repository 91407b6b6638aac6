// The import boundaries of eslint.config.js, checked on small samples linted in memory with
// ESLint's Node API. A sample is linted as if it were the file at `filePath`; the imports in it
// point at real modules of the repository, so they resolve as in the real lint.
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { ESLint, type Linter } from 'eslint';
import { beforeAll, describe, expect, it } from 'vitest';

const ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../..');

let eslint: ESLint;
beforeAll(() => {
  eslint = new ESLint({ cwd: ROOT, overrideConfigFile: path.join(ROOT, 'eslint.config.js') });
});

async function lint(filePath: string, code: string): Promise<Linter.LintMessage[]> {
  const [result] = await eslint.lintText(code, { filePath: path.join(ROOT, filePath) });
  return result.messages;
}

/** The boundary errors of a sample, as "line: message". */
async function boundaryErrors(filePath: string, code: string): Promise<string[]> {
  const messages = await lint(filePath, code);
  expect(messages.filter((m) => m.ruleId !== 'boundaries/dependencies')).toEqual([]);
  return messages.map((m) => `${m.line}: ${m.message}`);
}

describe('the lint refuses an import across a boundary', () => {
  it('reports a shared component that imports a feature', async () => {
    const errors = await boundaryErrors('src/components/sample.tsx', "import { useMe } from '@/features/auth/api/session';\nexport const x = useMe;\n");
    expect(errors).toHaveLength(1);
    expect(errors[0]).toMatch(/^1: .*"components".*"feature"/);
  });

  it('reports src/lib importing the app and a feature importing the app', async () => {
    expect(await boundaryErrors('src/lib/sample.ts', "import { router } from '@/app/router';\nexport const x = router;\n")).toHaveLength(1);
    expect(await boundaryErrors('src/features/catalogue/sample.ts', "import { router } from '@/app/router';\nexport const x = router;\n")).toHaveLength(1);
  });

  it('reports a feature reaching past another feature’s public module', async () => {
    const errors = await boundaryErrors(
      'src/features/catalogue/sample.ts',
      "import { ratingTablesQueryOptions } from '@/features/rating-tables/api/rating-tables';\nexport const x = ratingTablesQueryOptions;\n",
    );
    expect(errors).toEqual(['1: A feature imports another feature only through its public module, src/features/<name>/index.ts.']);
  });

  it('reports shared importing the server, the client or the Tailwind config, type-only imports included', async () => {
    const errors = await boundaryErrors(
      'shared/sample.ts',
      [
        "import { env } from '../server/config/env';",
        "import type { ApiError } from '../src/lib/api-client';",
        "import tokens from '../tailwind.config';",
        'export const x: [unknown, ApiError | null, unknown] = [env, null, tokens];',
      ].join('\n'),
    );
    expect(errors.map((e) => e.split(':')[0])).toEqual(['1', '2', '3']);
  });

  it('reports a router importing a model or the Sequelize instance', async () => {
    const errors = await boundaryErrors(
      'server/modules/auth/router.ts',
      "import { User } from '../../db/models';\nimport { sequelize } from '../../db/sequelize';\nexport const x = [User, sequelize];\n",
    );
    expect(errors).toEqual([
      '1: A router calls services; only services touch Sequelize and the models (server/db).',
      '2: A router calls services; only services touch Sequelize and the models (server/db).',
    ]);
  });

  it('reports the server importing the client or the Tailwind config', async () => {
    const errors = await boundaryErrors(
      'server/modules/projects/sample.ts',
      "import tokens from '../../../tailwind.config';\nimport { api } from '../../../src/lib/api-client';\nexport const x = [tokens, api];\n",
    );
    expect(errors).toHaveLength(2);
  });

  it('reports a disable comment that suppresses nothing', async () => {
    const messages = await lint('src/lib/sample.ts', '// eslint-disable-next-line no-console\nexport const x = 1;\n');
    expect(messages).toHaveLength(1);
    expect(messages[0]).toMatchObject({ ruleId: null, severity: 2, line: 1 });
    expect(messages[0].message).toMatch(/Unused eslint-disable directive/);
  });
});

describe('the lint lets allowed imports through', () => {
  it('passes a feature using another feature’s public module, shared UI, lib and shared', async () => {
    const code = [
      "import { RatingTableSummary } from '@/features/rating-tables';",
      "import { Panel } from '@/components/ui/states';",
      "import { api } from '@/lib/api-client';",
      "import { colors } from '@shared/design-tokens';",
      'export const x = [RatingTableSummary, Panel, api, colors];',
    ].join('\n');
    expect(await lint('src/features/catalogue/sample.tsx', code)).toEqual([]);
  });

  it('passes a feature importing its own inside', async () => {
    expect(await lint('src/features/rating-tables/sample.ts', "import { ratingTableKeys } from './api/rating-tables';\nexport const x = ratingTableKeys;\n")).toEqual([]);
  });

  it('passes the app importing deep into a feature and a component', async () => {
    const code = "import { MaterialPage } from '@/features/catalogue/components/material-page';\nimport { AppShell } from '@/components/app-shell';\nexport const x = [MaterialPage, AppShell];\n";
    expect(await lint('src/app/sample.tsx', code)).toEqual([]);
  });

  it('passes a service using a model, the Tailwind config and the PDF using design tokens', async () => {
    expect(await lint('server/modules/auth/sample-service.ts', "import { User } from '../../db/models';\nexport const x = User;\n")).toEqual([]);
    expect(await lint('tailwind.config.ts', "import { colors } from './shared/design-tokens';\nexport default { colors };\n")).toEqual([]);
    expect(await lint('server/modules/projects/record-pdf.ts', "import { colors } from '../../../shared/design-tokens';\nexport const x = colors;\n")).toEqual([]);
  });
});
