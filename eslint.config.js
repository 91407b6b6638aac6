// ESLint checks which part of the code may import which, and nothing of style. The parts are
// elements (by folder) and files (by name); the dependencies rule allows only the imports listed
// in POLICIES and reports every other import between known parts. Tests of this file:
// tests/lint/boundaries.test.ts.
import boundaries from 'eslint-plugin-boundaries';
import tseslint from 'typescript-eslint';

/** The parts of the repository, paths from its root; the first match wins. */
const ELEMENTS = [
  { type: 'app', pattern: 'src/app', partialMatch: false },
  { type: 'feature', pattern: 'src/features/*', capture: ['feature'], partialMatch: false },
  { type: 'components', pattern: 'src/components', partialMatch: false },
  { type: 'lib', pattern: 'src/lib', partialMatch: false },
  { type: 'styles', pattern: 'src/styles', partialMatch: false },
  { type: 'shared', pattern: 'shared', partialMatch: false },
  { type: 'db-models', pattern: 'server/db/models', partialMatch: false },
  { type: 'db', pattern: 'server/db', partialMatch: false },
  { type: 'server', pattern: 'server', partialMatch: false },
  { type: 'scripts', pattern: 'scripts', partialMatch: false },
];

/** Files that matter by name, wherever they sit. */
const FILES = [
  { category: 'client-entry', pattern: 'src/main.tsx' },
  { category: 'router', pattern: 'server/modules/*/router.ts' },
  { category: 'tailwind-config', pattern: 'tailwind.config.ts' },
  // Unit tests beside the code (tests/, bench/ and data/ belong to no part and are not checked).
  { category: 'test', pattern: '{src,server,shared}/**/*.test.{ts,tsx}' },
];

const element = (type, more = {}) => ({ element: { type, ...more } });
const toAny = (...types) => types.map((type) => ({ to: element(type) }));

/** Later policies override earlier ones; what no policy allows is refused. */
const POLICIES = [
  // The client: src/app → src/features → src/components, src/lib; anything → shared.
  { from: { file: { categories: 'client-entry' } }, allow: toAny('app', 'feature', 'components', 'lib', 'styles', 'shared') },
  { from: element('app'), allow: toAny('app', 'feature', 'components', 'lib', 'shared') },
  { from: element('feature'), allow: toAny('components', 'lib', 'shared') },
  // Another feature only through its public module, src/features/<name>/index.ts (a feature's own
  // files are its inside and not checked).
  { from: element('feature'), allow: { to: element('feature', { fileInternalPath: 'index.ts' }) } },
  {
    from: element('feature'),
    disallow: { to: element('feature', { fileInternalPath: '!index.ts' }) },
    message: 'A feature imports another feature only through its public module, src/features/<name>/index.ts.',
  },
  { from: element('components'), allow: toAny('components', 'lib', 'shared') },
  { from: element('lib'), allow: toAny('lib', 'shared') },
  // shared is isomorphic and pure: it imports only itself (no src/, server/ or build config).
  { from: element('shared'), allow: toAny('shared') },
  { from: { file: { categories: 'tailwind-config' } }, allow: toAny('shared') },
  // The server and its database layer.
  { from: element('server'), allow: toAny('server', 'db', 'db-models', 'shared') },
  { from: element('db'), allow: toAny('db', 'db-models', 'server', 'shared') },
  { from: element('db-models'), allow: toAny('db-models', 'db', 'server', 'shared') },
  {
    from: { file: { categories: 'router' } },
    disallow: toAny('db', 'db-models'),
    message: 'A router calls services; only services touch Sequelize and the models (server/db).',
  },
  // Development scripts (the local fakes of outside services) use the server's own pieces; unit
  // tests beside the code may start those fakes. Nothing else imports scripts/.
  { from: element('scripts'), allow: toAny('scripts', 'server', 'shared') },
  { from: { file: { categories: 'test' } }, allow: toAny('scripts') },
];

export default [
  { ignores: ['dist/**', 'node_modules/**', '.data/**', 'coverage/**', 'bench/tmp/**', 'test-results/**'] },
  {
    files: ['**/*.{ts,tsx,js,mjs,cjs}'],
    languageOptions: { parser: tseslint.parser, ecmaVersion: 'latest', sourceType: 'module' },
    linterOptions: { reportUnusedDisableDirectives: 'error' },
    plugins: { boundaries },
    settings: {
      'boundaries/elements': ELEMENTS,
      'boundaries/files': FILES,
      'import/resolver': { typescript: { project: './tsconfig.json' } },
    },
    rules: {
      'boundaries/dependencies': ['error', { default: 'disallow', checkUnknownLocals: true, policies: POLICIES }],
    },
  },
];
