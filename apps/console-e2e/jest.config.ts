export default {
  displayName: 'console-e2e',
  preset: '../../jest.preset.js',
  testEnvironment: 'node',
  transform: {
    '^.+\\.ts$': ['ts-jest', { tsconfig: '<rootDir>/tsconfig.json' }],
  },
  moduleFileExtensions: ['ts', 'js'],
  // A browser and a server start per file; give them room on a 2-core machine.
  testTimeout: 60_000,
};
