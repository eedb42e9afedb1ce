// ESLint flat config. The import zones below are the layout rules of this project, held by a tool:
//   app -> src/features -> src/api -> shared, server -> shared, no feature imports another feature,
//   nothing imports app/, and the client (app, src) and the server never import each other.
// src/components, src/lib and src/theme are shared client building blocks: features and routes use
// them, they may use src/api and shared, and they never import a feature.
const { defineConfig, globalIgnores } = require('eslint/config');
const expoConfig = require('eslint-config-expo/flat');
const tseslint = require('typescript-eslint');
const pluginReactHooksRules = require('eslint-plugin-react-hooks').configs.flat['recommended-latest'].rules;
const pluginQuery = require('@tanstack/eslint-plugin-query');
const prettierConfig = require('eslint-config-prettier');
const globals = require('globals');

const featureNames = require('node:fs')
  .readdirSync(require('node:path').join(__dirname, 'src/features'), { withFileTypes: true })
  .filter((entry) => entry.isDirectory())
  .map((entry) => entry.name);

const clientDirs = ['./app', './src'];
const importZones = [
  // nothing imports a route file
  { target: ['./src', './server', './shared'], from: './app', message: 'Route files are not imported; move the code into src/.' },
  // client and server never meet; shared stays free of both
  { target: clientDirs, from: './server', message: 'The client never imports server code; share it through shared/.' },
  { target: './server', from: './src', message: 'The server never imports client code; share it through shared/.' },
  { target: './shared', from: ['./src', './server'], message: 'shared/ is pure: no client or server imports.' },
  // building blocks below the features
  {
    target: ['./src/components', './src/lib', './src/theme', './src/api', './src/config'],
    from: './src/features',
    message: 'Only routes import features; move what both need into src/components or src/lib.',
  },
  {
    target: './src/api',
    from: ['./src/components', './src/lib', './src/theme'],
    message: 'src/api sits below the screens: it imports only shared/ and src/config.',
  },
  { target: './src/theme', from: ['./src/components', './src/lib', './src/api'], message: 'The theme imports nothing of the app.' },
  // no feature imports another feature
  ...featureNames.map((name) => ({
    target: `./src/features/${name}`,
    from: './src/features',
    except: [`./${name}`],
    message: 'A feature never imports another feature; move what both need into src/components or src/lib.',
  })),
];

const typeCheckedRules = Object.assign(
  {},
  ...tseslint.configs.recommendedTypeChecked.map((config) => config.rules ?? {}),
);

module.exports = defineConfig([
  globalIgnores([
    'node_modules/',
    'dist/',
    '.expo/',
    '.data/',
    '.cache/',
    'shots/',
    'test-results/',
    'playwright-report/',
    'expo-env.d.ts',
    '.ci/',
  ]),
  expoConfig,
  {
    files: ['**/*.ts', '**/*.tsx'],
    languageOptions: {
      parserOptions: { projectService: true, tsconfigRootDir: __dirname },
    },
    rules: {
      // typescript-eslint's recommended type-checked rules (the Expo config already registers the
      // plugin, so only the rules are taken over)
      ...typeCheckedRules,
      // Kept: the type-aware rules that catch real bugs (floating and misused promises, awaiting
      // non-promises, unsafe any reaching typed code). Relaxed where the tree would need churn
      // without catching bugs:
      '@typescript-eslint/no-unused-vars': ['error', { args: 'none', ignoreRestSiblings: true, caughtErrors: 'none' }],
      '@typescript-eslint/consistent-type-imports': ['error', { fixStyle: 'inline-type-imports' }],
      // Express 5 and React event props take promise-returning handlers on purpose.
      '@typescript-eslint/no-misused-promises': ['error', { checksVoidReturn: { arguments: false, attributes: false } }],
      '@typescript-eslint/require-await': 'off',
      // template literals with numbers are the normal way to print figures here
      '@typescript-eslint/restrict-template-expressions': ['error', { allowNumber: true }],
      // A redundant `as` is noise, not a bug; removing 150 of them across the tree is churn.
      '@typescript-eslint/no-unnecessary-type-assertion': 'off',
      // `any` read from Express errors and Yup's `this.parent` is checked at run time where it is
      // read; typing each of those reads is churn. Passing `any` on into typed code stays an error.
      '@typescript-eslint/no-unsafe-member-access': 'off',
      '@typescript-eslint/no-unsafe-assignment': 'off',
      '@typescript-eslint/no-unsafe-call': 'off',
      '@typescript-eslint/no-unsafe-return': 'off',
      // TypeScript itself reports real redeclarations; a value and a type of one name is intended.
      '@typescript-eslint/no-redeclare': 'off',
    },
  },
  {
    // Test bodies read `any` responses (supertest, page.evaluate); the assertions check their shape.
    files: ['tests/**', 'e2e/**'],
    rules: { '@typescript-eslint/no-unsafe-argument': 'off' },
  },
  {
    files: ['**/*.js', '**/*.mjs', '**/*.cjs'],
    rules: tseslint.configs.disableTypeChecked.rules,
    languageOptions: { globals: globals.node },
  },
  {
    // The two classic hook rules. The React Compiler rules of the same plugin (refs, immutability,
    // set-state-in-effect, ...) wait until the request-draft hook and the session guard are reworked.
    rules: {
      'react-hooks/rules-of-hooks': 'error',
      'react-hooks/exhaustive-deps': 'error',
      ...Object.fromEntries(
        Object.keys(pluginReactHooksRules)
          .filter((rule) => !['react-hooks/rules-of-hooks', 'react-hooks/exhaustive-deps'].includes(rule))
          .map((rule) => [rule, 'off']),
      ),
    },
  },
  ...pluginQuery.configs['flat/recommended'],
  {
    rules: {
      'import/no-restricted-paths': ['error', { zones: importZones }],
      'import/no-cycle': 'error',
      // `import fc from 'fast-check'; fc.assert(...)` is how those libraries document themselves.
      'import/no-named-as-default': 'off',
      'import/no-named-as-default-member': 'off',
      // Apostrophes are the product's words in React Native <Text>; only `>` and `}` are typos.
      'react/no-unescaped-entities': ['error', { forbid: ['>', '}'] }],
    },
  },
  {
    files: ['server/**', 'scripts/**', 'tests/server/**', 'tests/shared/**', 'e2e/**', '*.config.*'],
    languageOptions: { globals: globals.node },
  },
  {
    files: ['tests/**', 'e2e/**'],
    languageOptions: { globals: { ...globals.jest } },
  },
  prettierConfig,
]);
