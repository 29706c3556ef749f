// ESLint with Expo's flat config, plus rules that keep the import arrows honest (see DEVELOPERS.md).
const { defineConfig } = require('eslint/config');
const expoConfig = require('eslint-config-expo/flat');

const noServer = { group: ['@/server/*', '**/server/*'], message: 'Nothing outside server/ imports server code.' };

module.exports = defineConfig([
  expoConfig,
  { ignores: ['dist/*', '.data/*', '.cache/*', 'node_modules/*', 'test-results/*', 'bench-results/*', '.expo/*'] },
  {
    files: ['lib/chem/**/*.ts'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          patterns: [
            noServer,
            { group: ['react', 'react-native', 'express', '@mikro-orm/*', 'node:*', 'fs', 'path'], message: 'lib/chem is pure: no I/O, React, Express or ORM.' },
          ],
        },
      ],
    },
  },
  {
    // fast-check's documented style is `fc.property(fc.integer(), …)`; jest.mock factories must require().
    files: ['tests/**/*.{ts,tsx}'],
    rules: { 'import/no-named-as-default-member': 'off', '@typescript-eslint/no-require-imports': 'off' },
  },
  {
    files: ['app/**/*.{ts,tsx}', 'components/**/*.{ts,tsx}', 'lib/api/**/*.ts', 'lib/schemas/**/*.ts'],
    rules: { 'no-restricted-imports': ['error', { patterns: [noServer] }] },
  },
  {
    // Production code never imports the development stand-ins or their packages (devDependencies);
    // only the start script loads server/dev, with a dynamic import outside production.
    files: ['server/**/*.ts'],
    ignores: ['server/dev/**'],
    rules: {
      'no-restricted-imports': [
        'error',
        {
          paths: [
            { name: 'smtp-server', message: 'A development stand-in: keep it in server/dev.' },
            { name: 's3rver', message: 'A development stand-in: keep it in server/dev.' },
          ],
          patterns: [{ group: ['@/server/dev', '@/server/dev/*', './dev', './dev/*', '../dev', '../dev/*', '**/dev', '**/dev/*'], message: 'Production code does not import server/dev (see server/development-tools.ts).' }],
        },
      ],
    },
  },
  {
    files: ['server/**/*.ts'],
    ignores: ['server/dev/**', 'server/index.ts'],
    rules: {
      'no-restricted-syntax': [
        'error',
        { selector: 'ImportExpression[source.value=/(^|\\/)dev(\\/|$)/]', message: 'Only server/index.ts loads server/dev, and only outside production.' },
      ],
    },
  },
]);
