// One jest run, three projects (see DEVELOPERS.md): the pure engines, the server against a real
// throwaway PostgreSQL, and React Native components under jest-expo.
const nodeTransform = {
  '\\.[jt]sx?$': [
    'babel-jest',
    {
      presets: ['babel-preset-expo'],
      caller: { name: 'metro', bundler: 'metro', platform: 'web', isServer: true },
    },
  ],
};
// lucia, oslo and @oslojs are ESM-only: let babel transform them.
const esmAllowed = ['transformIgnorePatterns', ['/node_modules/(?!(lucia|oslo|@oslojs)/)']];

module.exports = {
  // Server suites seed the demo lab (Argon2 hashes, ~60 complexes): generous on a busy 2-core machine.
  testTimeout: 30_000,
  projects: [
    {
      displayName: 'lib',
      testEnvironment: 'node',
      testMatch: ['<rootDir>/tests/lib/**/*.test.ts'],
      transform: nodeTransform,
      moduleNameMapper: { '^@/(.*)$': '<rootDir>/$1' },
    },
    {
      displayName: 'server',
      testEnvironment: 'node',
      testMatch: ['<rootDir>/tests/server/**/*.test.ts'],
      transform: nodeTransform,
      [esmAllowed[0]]: esmAllowed[1],
      moduleNameMapper: { '^@/(.*)$': '<rootDir>/$1' },
      globalSetup: '<rootDir>/tests/setup/server-global-setup.ts',
      setupFiles: ['<rootDir>/tests/setup/development-tools.ts'],
    },
    {
      // `npm run test:reliability`: fuzzing, hostile input, load and faults (minutes, not seconds).
      displayName: 'reliability',
      testEnvironment: 'node',
      testMatch: ['<rootDir>/tests/reliability/**/*.test.ts'],
      transform: nodeTransform,
      [esmAllowed[0]]: esmAllowed[1],
      moduleNameMapper: { '^@/(.*)$': '<rootDir>/$1' },
      globalSetup: '<rootDir>/tests/setup/server-global-setup.ts',
      setupFiles: ['<rootDir>/tests/setup/development-tools.ts'],
    },
    {
      displayName: 'components',
      preset: 'jest-expo',
      testMatch: ['<rootDir>/tests/components/**/*.test.tsx'],
      moduleNameMapper: { '^@/(.*)$': '<rootDir>/$1' },
    },
  ],
};
