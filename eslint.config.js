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
]);
